import { availableParallelism } from 'node:os';
import { HEAD_BYTES, readLogHead } from '../log/log-head';
import { LineCount } from '../log/line-counter';
import { mergeRanges } from '../log/range-merge';
import { planRanges } from '../log/range-plans';
import { RangeSummary } from '../log/range-analysis';
import { FIELD } from '../log/round-fields';
import { aesKeystream } from './aes-keystream';
import { AnalysisRequest } from './analysis-request';
import { progressCounter, ProgressListener } from './analysis-progress';
import { splitIntoLineRanges } from './byte-ranges';
import { hashFile } from './file-hash';
import { NO_ROUNDS, ReadOutcome } from './read-outcome';
import { RangeTask, RangeTaskResult, runRangeTask } from './range-task';
import { WorkerPool } from './worker-pool';

/** Below this size a plain file is read in the caller's thread: starting workers would cost more than they save. */
const THREADS_FROM_BYTES = 16 * 1024 * 1024;

/** Threads for a plain file of `size` bytes: as asked, or both cores for large files. */
export function threadsFor(size: number, asked: number | undefined): number {
  return Math.max(1, asked ?? (size >= THREADS_FROM_BYTES ? Math.min(2, availableParallelism()) : 1));
}

/**
 * Reads a plain (uncompressed) log file by byte ranges: the counting pass (line counts per range,
 * with the file's SHA-256 alongside), then the analysis pass, each range in its own worker thread
 * when there are several; the range summaries merge exactly into that of the whole file.
 */
export async function readByRanges(
  path: string,
  size: number,
  head: Uint8Array,
  request: AnalysisRequest,
  threads: number,
  listener: ProgressListener | undefined,
  signal: AbortSignal | undefined,
): Promise<ReadOutcome> {
  const cancelled = () => signal?.aborted === true;
  const input = { sha256: '', bytes: size, rounds: 0, compression: 'none' as const };
  const logHead = readLogHead(head, size <= HEAD_BYTES, request.mapping, request.profile.testSelection.mode === 'from-log');
  const countProgress = progressCounter('counting', size, listener);
  if (!logHead.ok) {
    return { kind: 'unreadable', input: { ...input, sha256: await hashFile(path, countProgress, cancelled) }, problems: [logHead.problem], problemCount: 1 };
  }
  const ranges = await splitIntoLineRanges(path, logHead.dataOffset, size, threads);
  const pool = ranges.length > 1 ? new WorkerPool(ranges.length, signal) : null;
  const runAll = (tasks: RangeTask[], onBytes: (bytes: number) => void): Promise<RangeTaskResult[]> =>
    pool !== null ? pool.runAll(tasks, onBytes) : Promise.all(tasks.map((task) => runRangeTask(task, onBytes, cancelled)));
  try {
    const [sha256, counted] = await Promise.all([
      hashFile(path, countProgress, cancelled),
      runAll(ranges.map((range) => ({ kind: 'count', path, range })), () => undefined),
    ]);
    const counts = counted as LineCount[];
    const rounds = counts.reduce((sum, count) => sum + count.records, 0);
    if (rounds === 0) {
      return { kind: 'unreadable', input: { ...input, sha256 }, problems: [NO_ROUNDS], problemCount: 1 };
    }
    if (cancelled()) {
      return { kind: 'unreadable', input: { ...input, sha256, rounds }, problems: [], problemCount: 0 };
    }
    const plans = planRanges(logHead.layout, request.profile, counts, request.seed === null ? null : aesKeystream(request.seed));
    const tasks: RangeTask[] = ranges.map((range, i) => ({ kind: 'analyse', path, range, plan: plans[i], seed: request.seed }));
    const summaries = (await runAll(tasks, progressCounter('analysing', size, listener))) as RangeSummary[];
    const roundColumn = logHead.layout.columnNames[logHead.layout.columnOfField[FIELD.round]];
    return { kind: 'read', input: { ...input, sha256, rounds }, summary: mergeRanges(summaries, request.profile.driftBlocks, roundColumn) };
  } finally {
    await pool?.close();
  }
}
