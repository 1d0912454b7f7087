import { availableParallelism } from 'node:os';
import { HEAD_BYTES, readLogHead } from '../log/log-head';
import { mergeRanges } from '../log/range-merge';
import { planRanges, spanProblem, triggerSpan } from '../log/range-plans';
import { FIELD } from '../log/round-fields';
import { AnalysisRequest } from './analysis-request';
import { progressCounter, ProgressListener } from './analysis-progress';
import { splitIntoLineRanges } from './byte-ranges';
import { CountingPass, hashAndCount } from './counting-pass';
import { readRecordEdges } from './edge-reading';
import { NO_ROUNDS, ReadOutcome } from './read-outcome';
import { ByteRange, RangeTask, runRangeTask } from './range-task';
import { WorkerPool } from './worker-pool';

/** Below this size a plain file is read in the caller's thread: starting workers would cost more than they save. */
const THREADS_FROM_BYTES = 16 * 1024 * 1024;

/** Threads for a plain file of `size` bytes: as asked, or both cores for large files. */
export function threadsFor(size: number, asked: number | undefined): number {
  return Math.max(1, asked ?? (size >= THREADS_FROM_BYTES ? Math.min(2, availableParallelism()) : 1));
}

/**
 * Reads a plain (uncompressed) log file by byte ranges. The counting pass: the file's SHA-256 and
 * the line counts per range, in one read with one thread, or with several the caller's thread
 * hashing while the first worker thread counts. Then the analysis pass, the caller's thread reading
 * the first range and a worker thread each other one; the range summaries merge exactly into that
 * of the whole file.
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
  const input = { sha256: '', bytes: size, rounds: 0, compression: 'none' as const };
  const cancelled = () => signal?.aborted === true;
  const logHead = readLogHead(head, size <= HEAD_BYTES, request.mapping, request.profile.testSelection.mode === 'from-log');
  const countProgress = progressCounter('counting', size, listener);
  if (!logHead.ok) {
    const { sha256 } = await hashAndCount(path, size, [], true, countProgress, cancelled);
    return { kind: 'unreadable', input: { ...input, sha256 }, problems: [logHead.problem], problemCount: 1 };
  }
  const ranges = await splitIntoLineRanges(path, logHead.dataOffset, size, threads);
  const pool = ranges.length > 1 ? new WorkerPool(ranges.length - 1, signal) : null;
  try {
    const counting = pool === null ? hashAndCount(path, size, ranges, true, countProgress, cancelled) : hashWhileCounting(pool, path, size, ranges, countProgress, cancelled);
    const [{ sha256, counts }, edges] = await Promise.all([counting, readRecordEdges(path, size, head, logHead.dataOffset, ranges, logHead.layout)]);
    const rounds = counts.reduce((sum, count) => sum + count.records, 0);
    if (rounds === 0) {
      return { kind: 'unreadable', input: { ...input, sha256 }, problems: [NO_ROUNDS], problemCount: 1 };
    }
    if (cancelled()) {
      return { kind: 'unreadable', input: { ...input, sha256, rounds }, problems: [], problemCount: 0 };
    }
    const badSpan = spanProblem(triggerSpan(edges, rounds), rounds, logHead.layout);
    if (badSpan !== null) {
      return { kind: 'unreadable', input: { ...input, sha256, rounds }, problems: [badSpan], problemCount: 1 };
    }
    const plans = planRanges(logHead.layout, request.profile, counts, edges);
    const tasks: RangeTask[] = ranges.map((range, i) => ({ path, range, plan: plans[i], seed: request.seed }));
    const onBytes = progressCounter('analysing', size, listener);
    onBytes(logHead.dataOffset); // the header, read before this pass
    const [own, ...others] = tasks;
    const summaries = await Promise.all([runRangeTask(own, onBytes, cancelled), ...(pool?.runAll(others, onBytes) ?? [])]);
    const roundColumn = logHead.layout.columnNames[logHead.layout.columnOfField[FIELD.round]];
    return { kind: 'read', input: { ...input, sha256, rounds }, summary: mergeRanges(summaries, request.profile.driftBlocks, roundColumn) };
  } finally {
    await pool?.close();
  }
}

/** The counting pass on two threads: SHA-256 here, the line counts in the pool's first thread. */
async function hashWhileCounting(pool: WorkerPool, path: string, size: number, ranges: ByteRange[], onBytes: (bytes: number) => void, cancelled: () => boolean): Promise<CountingPass> {
  const [hashed, counts] = await Promise.all([hashAndCount(path, size, [], true, onBytes, cancelled), pool.countLines(path, size, ranges)]);
  return { sha256: hashed.sha256, counts };
}
