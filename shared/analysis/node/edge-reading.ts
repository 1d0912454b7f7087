import { open } from 'node:fs/promises';
import { HeaderLayout } from '../log/header-layout';
import { firstRecordLine, lastRecordLine, RecordEdges, roundOfLine } from '../log/record-edges';
import { ByteRange } from './range-task';

/** Bytes read back from a cut to find the record before it; a longer record is no round record. */
const TAIL_BYTES = 64 * 1024;

/**
 * The edge round indices of a plain log file (see `RecordEdges`): the first record from the head,
 * the last record of the file and the last record before each range, each from one short read.
 */
export async function readRecordEdges(path: string, size: number, head: Uint8Array, dataOffset: number, ranges: readonly ByteRange[], layout: HeaderLayout): Promise<RecordEdges> {
  const file = await open(path, 'r');
  try {
    const buffer = Buffer.allocUnsafe(TAIL_BYTES);
    const roundBefore = async (offset: number): Promise<number> => {
      const from = Math.max(dataOffset, offset - TAIL_BYTES);
      const { bytesRead } = await file.read(buffer, 0, offset - from, from);
      const line = lastRecordLine(buffer.subarray(0, bytesRead));
      // A line reaching back to the start of a read that began mid-file may be cut: unreadable.
      const cut = line !== null && from > dataOffset && line.byteOffset === buffer.byteOffset;
      return cut ? NaN : roundOfLine(line, layout);
    };
    const previousRounds = [NaN];
    for (const range of ranges.slice(1)) {
      previousRounds.push(await roundBefore(range.start));
    }
    return { firstRound: roundOfLine(firstRecordLine(head.subarray(dataOffset)), layout), lastRound: await roundBefore(size), previousRounds };
  } finally {
    await file.close();
  }
}
