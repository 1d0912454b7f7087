import { createHash } from 'node:crypto';
import { open } from 'node:fs/promises';
import { LineCount } from '../log/line-counter';
import { createLineCounter } from './wasm-line-counter';
import { READ_CHUNK_BYTES } from './log-source';
import { ByteRange } from './range-task';

/** The file's SHA-256 (when asked for) and the line count of each range. */
export interface CountingPass {
  sha256: string;
  counts: LineCount[];
}

/**
 * The counting pass over a plain file, in one sequential read: SHA-256 (FIPS 180-4) of all bytes
 * when `hashing`, and the lines and records of each range. With two threads the caller's thread
 * hashes while a worker thread counts (`sha256` is then empty in the worker's answer).
 */
export async function hashAndCount(
  path: string,
  size: number,
  ranges: readonly ByteRange[],
  hashing: boolean,
  onBytes: (bytes: number) => void,
  cancelled: () => boolean,
): Promise<CountingPass> {
  const hash = hashing ? createHash('sha256') : null;
  const counters = ranges.map(() => createLineCounter());
  const file = await open(path, 'r');
  try {
    const buffer = Buffer.allocUnsafe(READ_CHUNK_BYTES);
    const from = hashing ? 0 : (ranges[0]?.start ?? size);
    for (let position = from; position < size && !cancelled();) {
      const { bytesRead } = await file.read(buffer, 0, Math.min(buffer.length, size - position), position);
      if (bytesRead === 0) {
        break;
      }
      const chunk = buffer.subarray(0, bytesRead);
      hash?.update(chunk);
      ranges.forEach((range, i) => {
        const start = Math.max(range.start - position, 0);
        const end = Math.min(range.end - position, bytesRead);
        if (start < end) {
          counters[i].push(chunk.subarray(start, end));
        }
      });
      position += bytesRead;
      onBytes(bytesRead);
    }
  } finally {
    await file.close();
  }
  return { sha256: hash?.digest('hex') ?? '', counts: counters.map((counter) => counter.finish()) };
}
