import { open } from 'node:fs/promises';
import { ByteRange } from './range-task';

const LF = 10;
const PROBE_BYTES = 64 * 1024;

/**
 * Splits the data of a plain log file, [dataStart, size), into about `parts` ranges of similar size,
 * each starting just after a line break, so every line lies in exactly one range.
 */
export async function splitIntoLineRanges(path: string, dataStart: number, size: number, parts: number): Promise<ByteRange[]> {
  const cuts = [dataStart];
  const file = await open(path, 'r');
  try {
    const probe = Buffer.allocUnsafe(PROBE_BYTES);
    for (let part = 1; part < parts; part++) {
      const target = Math.max(dataStart + Math.floor(((size - dataStart) * part) / parts), cuts[cuts.length - 1]);
      const cut = await nextLineStart(file, probe, target, size);
      if (cut > cuts[cuts.length - 1] && cut < size) {
        cuts.push(cut);
      }
    }
  } finally {
    await file.close();
  }
  return cuts.map((start, i) => ({ start, end: cuts[i + 1] ?? size }));
}

/** The offset just after the first line break at or after `from`, or `size` if there is none. */
async function nextLineStart(file: Awaited<ReturnType<typeof open>>, probe: Buffer, from: number, size: number): Promise<number> {
  for (let position = from; position < size; position += probe.length) {
    const { bytesRead } = await file.read(probe, 0, probe.length, position);
    const newline = probe.subarray(0, bytesRead).indexOf(LF);
    if (newline >= 0) {
      return position + newline + 1;
    }
  }
  return size;
}
