import { open } from 'node:fs/promises';
import { ByteScanner } from '../log/byte-scanner';
import { LineCount, LineCounter } from '../log/line-counter';
import { RangeAnalysis, RangePlan, RangeSummary } from '../log/range-analysis';
import { aesKeystream } from './aes-keystream';
import { READ_CHUNK_BYTES } from './log-source';

/** A byte range of a plain (uncompressed) log file: [start, end). */
export interface ByteRange {
  start: number;
  end: number;
}

/** One job on one byte range: the counting pass, or the analysis pass. */
export type RangeTask =
  | { kind: 'count'; path: string; range: ByteRange }
  | { kind: 'analyse'; path: string; range: ByteRange; plan: RangePlan; seed: string | null };

/** What a task returns. */
export type RangeTaskResult = LineCount | RangeSummary;

/** Where a task's bytes go. */
interface RangeReader {
  push(chunk: Uint8Array): void;
  finish(): RangeTaskResult;
}

/** The reader of a task: the line counter, or the byte scanner feeding a range analysis. */
function readerFor(task: RangeTask): RangeReader {
  if (task.kind === 'count') {
    const counter = new LineCounter();
    return { push: (chunk) => counter.push(chunk), finish: () => counter.finish() };
  }
  const analysis = new RangeAnalysis(task.plan, task.seed === null ? null : aesKeystream(task.seed));
  const scanner = new ByteScanner(task.plan.layout, analysis, task.plan.firstLine);
  return {
    push: (chunk) => scanner.push(chunk),
    finish: () => {
      scanner.finish();
      return analysis.summary();
    },
  };
}

/**
 * Runs a task on its byte range, reading the file in chunks; `onBytes` hears of each chunk read and
 * `cancelled` is asked between chunks. The same function runs in a worker thread or in the caller's.
 */
export async function runRangeTask(task: RangeTask, onBytes: (bytes: number) => void, cancelled: () => boolean): Promise<RangeTaskResult> {
  const reader = readerFor(task);
  const file = await open(task.path, 'r');
  try {
    const buffer = Buffer.allocUnsafe(READ_CHUNK_BYTES);
    for (let position = task.range.start; position < task.range.end && !cancelled(); ) {
      const { bytesRead } = await file.read(buffer, 0, Math.min(buffer.length, task.range.end - position), position);
      if (bytesRead === 0) {
        break;
      }
      reader.push(buffer.subarray(0, bytesRead));
      position += bytesRead;
      onBytes(bytesRead);
    }
  } finally {
    await file.close();
  }
  return reader.finish();
}
