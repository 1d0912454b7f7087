import { createHash } from 'node:crypto';
import { open } from 'node:fs/promises';
import { LineCount, LineCounter } from '../log/line-counter';
import { READ_CHUNK_BYTES } from './log-source';
import { ByteRange } from './range-task';

/** The file's SHA-256 and the line count of each range. */
export interface CountingPass {
  sha256: string;
  counts: LineCount[];
}

/**
 * The counting pass over a plain file, in one sequential read: SHA-256 (FIPS 180-4) of all bytes, and
 * the lines and records of each range. Cheap enough (memory speed) that worker threads would not pay.
 */
export async function hashAndCount(path: string, size: number, ranges: readonly ByteRange[], onBytes: (bytes: number) => void, cancelled: () => boolean): Promise<CountingPass> {
  const hash = createHash('sha256');
  const counters = ranges.map(() => new LineCounter());
  const file = await open(path, 'r');
  try {
    const buffer = Buffer.allocUnsafe(READ_CHUNK_BYTES);
    for (let position = 0; position < size && !cancelled(); ) {
      const { bytesRead } = await file.read(buffer, 0, Math.min(buffer.length, size - position), position);
      if (bytesRead === 0) {
        break;
      }
      const chunk = buffer.subarray(0, bytesRead);
      hash.update(chunk);
      ranges.forEach((range, i) => {
        const from = Math.max(range.start - position, 0);
        const to = Math.min(range.end - position, bytesRead);
        if (from < to) {
          counters[i].push(chunk.subarray(from, to));
        }
      });
      position += bytesRead;
      onBytes(bytesRead);
    }
  } finally {
    await file.close();
  }
  return { sha256: hash.digest('hex'), counts: counters.map((counter) => counter.finish()) };
}
