import { open } from 'node:fs/promises';
import { ByteScanner } from '../log/byte-scanner';
import { RangeAnalysis, RangePlan, RangeSummary } from '../log/range-analysis';
import { withTestsBefore } from '../log/range-plans';
import { aesKeystream } from './aes-keystream';
import { createRowKernel } from './wasm-row-kernel';
import { READ_CHUNK_BYTES } from './log-source';

/** A byte range of a plain (uncompressed) log file: [start, end). */
export interface ByteRange {
  start: number;
  end: number;
}

/** The analysis pass over one byte range of a plain file, with its plan. Plain data, so it can go to a worker. */
export interface RangeTask {
  path: string;
  range: ByteRange;
  plan: RangePlan;
  seed: string | null;
  /** Whether the common rows go to the row kernel. */
  rowKernel: boolean;
}

/** What reading a byte range gives: its summary, and the lines it held (blank ones too). */
export interface RangeReading extends RangeSummary {
  lines: number;
}

/**
 * Runs a task on its byte range, reading the file in chunks into the byte scanner; `onBytes` hears
 * of each chunk read and `cancelled` is asked between chunks. The same function runs in a worker
 * thread or in the caller's; each counts the fixed-fraction test rounds before its own range.
 */
export async function runRangeTask(task: RangeTask, onBytes: (bytes: number) => void, cancelled: () => boolean): Promise<RangeReading> {
  const keystream = task.seed === null ? null : aesKeystream(task.seed);
  const plan = withTestsBefore(task.plan, keystream);
  const analysis = new RangeAnalysis(plan, keystream);
  const scanner = new ByteScanner(plan.layout, analysis, plan.firstLine, task.rowKernel ? createRowKernel(plan.layout) : null);
  const file = await open(task.path, 'r');
  try {
    const buffer = Buffer.allocUnsafe(READ_CHUNK_BYTES);
    for (let position = task.range.start; position < task.range.end && !cancelled();) {
      const { bytesRead } = await file.read(buffer, 0, Math.min(buffer.length, task.range.end - position), position);
      if (bytesRead === 0) {
        break;
      }
      scanner.push(buffer.subarray(0, bytesRead));
      position += bytesRead;
      onBytes(bytesRead);
    }
  } finally {
    await file.close();
  }
  scanner.finish();
  return { ...analysis.summary(), lines: scanner.nextLine - plan.firstLine };
}
