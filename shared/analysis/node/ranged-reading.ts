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
import { ByteRange, RangeReading, RangeTask, runRangeTask } from './range-task';
import { CensusRanges, rangesFromCensus, StoredCensus } from './census-ranges';
import { LineCount } from '../log/line-counter';
import { LogProblem } from '../log/log-problem';
import { WorkerPool } from './worker-pool';

/** Below this size a plain file is read in the caller's thread: starting workers would cost more than they save. */
const THREADS_FROM_BYTES = 16 * 1024 * 1024;

/** Threads for a plain file of `size` bytes: as asked, or both cores for large files. */
export function threadsFor(size: number, asked: number | undefined): number {
  return Math.max(1, asked ?? (size >= THREADS_FROM_BYTES ? Math.min(2, availableParallelism()) : 1));
}

/** The census the caller has, and what to do when the bytes show it does not fit them. */
export interface CensusUse {
  stored: StoredCensus;
  onMismatch: (reason: string) => void;
}

/**
 * Reads a plain (uncompressed) log file by byte ranges. Without a census, the counting pass: the
 * file's SHA-256 and the line counts per range, in one read with one thread, or with several the
 * caller's thread hashing while the first worker thread counts. Then the analysis pass, the
 * caller's thread reading the first range and a worker thread each other one; the range summaries
 * merge exactly into that of the whole file. With a census taken at upload (and two threads or
 * more), one pass: the ranges and their counts come from the census, and a thread of its own
 * hashes the file while the others analyse it. The census is then checked against the bytes (the
 * hash, and the lines and records of every range); if it does not fit, its analysis is thrown
 * away and the file is read again with a counting pass.
 */
export async function readByRanges(
  path: string,
  size: number,
  head: Uint8Array,
  request: AnalysisRequest,
  threads: number,
  listener: ProgressListener | undefined,
  signal: AbortSignal | undefined,
  census?: CensusUse,
): Promise<ReadOutcome> {
  const input = { sha256: '', bytes: size, rounds: 0, compression: 'none' as const };
  const cancelled = () => signal?.aborted === true;
  const logHead = readLogHead(head, size <= HEAD_BYTES, request.mapping, request.profile.testSelection.mode === 'from-log');
  if (!logHead.ok) {
    const { sha256 } = await hashAndCount(path, size, [], true, progressCounter('counting', size, listener), cancelled);
    return { kind: 'unreadable', input: { ...input, sha256 }, problems: [logHead.problem], problemCount: 1 };
  }
  const fromCensus = census && threads > 1 ? rangesFromCensus(census.stored.census, logHead.dataOffset, size, threads) : null;
  if (census && fromCensus) {
    const pool = new WorkerPool(fromCensus.ranges.length, signal);
    try {
      const hashing = pool.hash(path, size);
      const outcome = await analyseRanges(path, size, head, logHead, fromCensus, hashing, request, pool, listener, cancelled);
      const sha256 = await hashing;
      // A log found unreadable before its ranges were read (no rounds, a bad span) proves nothing of the census: count.
      const misfit = outcome.readings.length === 0 ? null : censusMisfit(census.stored, sha256, fromCensus.counts, outcome.readings);
      if (cancelled() || (outcome.readings.length > 0 && misfit === null)) return outcome.outcome;
      if (misfit !== null) census.onMismatch(misfit);
    } finally {
      await pool.close();
    }
  } else if (census && threads > 1) {
    census.onMismatch(`its size or marks do not fit a file of ${size} bytes`);
  }
  const countProgress = progressCounter('counting', size, listener);
  const ranges = await splitIntoLineRanges(path, logHead.dataOffset, size, threads);
  const pool = ranges.length > 1 ? new WorkerPool(ranges.length - 1, signal) : null;
  try {
    const counting = pool === null ? hashAndCount(path, size, ranges, true, countProgress, cancelled) : hashWhileCounting(pool, path, size, ranges, countProgress, cancelled);
    const { sha256, counts } = await counting;
    return (await analyseRanges(path, size, head, logHead, { ranges, counts }, Promise.resolve(sha256), request, pool, listener, cancelled)).outcome;
  } finally {
    await pool?.close();
  }
}

/**
 * The analysis pass over ranges whose counts are known: the caller's thread reads the first range,
 * the pool's first threads the others. Returns the outcome and what each range held.
 */
async function analyseRanges(
  path: string,
  size: number,
  head: Uint8Array,
  logHead: Extract<ReturnType<typeof readLogHead>, { ok: true }>,
  { ranges, counts }: CensusRanges,
  hashing: Promise<string>,
  request: AnalysisRequest,
  pool: WorkerPool | null,
  listener: ProgressListener | undefined,
  cancelled: () => boolean,
): Promise<{ outcome: ReadOutcome; readings: RangeReading[] }> {
  const input = { sha256: '', bytes: size, rounds: 0, compression: 'none' as const };
  const rounds = counts.reduce((sum, count) => sum + count.records, 0);
  const edges = await readRecordEdges(path, size, head, logHead.dataOffset, ranges, logHead.layout);
  const unreadable = async (problems: LogProblem[]) => ({
    outcome: { kind: 'unreadable' as const, input: { ...input, sha256: await hashing, rounds }, problems, problemCount: problems.length },
    readings: [],
  });
  if (rounds === 0) return unreadable([NO_ROUNDS]);
  if (cancelled()) return unreadable([]);
  const badSpan = spanProblem(triggerSpan(edges, rounds), rounds, logHead.layout);
  if (badSpan !== null) return unreadable([badSpan]);
  const plans = planRanges(logHead.layout, request.profile, counts, edges);
  const tasks: RangeTask[] = ranges.map((range, i) => ({ path, range, plan: plans[i], seed: request.seed, rowKernel: request.rowKernel }));
  const onBytes = progressCounter('analysing', size, listener);
  onBytes(logHead.dataOffset); // the header, read before this pass
  const [own, ...others] = tasks;
  const readings = await Promise.all([runRangeTask(own, onBytes, cancelled), ...(pool?.runAll(others, onBytes) ?? [])]);
  const roundColumn = logHead.layout.columnNames[logHead.layout.columnOfField[FIELD.round]];
  return { outcome: { kind: 'read', input: { ...input, sha256: await hashing, rounds }, summary: mergeRanges(readings, request.profile.driftBlocks, roundColumn) }, readings };
}

/** Why a census does not fit the bytes read, or null when it does. */
function censusMisfit(stored: StoredCensus, sha256: string, counts: readonly LineCount[], readings: readonly RangeReading[]): string | null {
  if (sha256 !== stored.sha256) return `it was taken of bytes hashing to ${stored.sha256}, the file hashes to ${sha256}`;
  const wrong = readings.findIndex((reading, i) => reading.lines !== counts[i].lines || reading.records !== counts[i].records);
  if (wrong < 0) return null;
  const { lines, records } = readings[wrong];
  return `byte range ${wrong + 1} holds ${lines} lines and ${records} records, the census says ${counts[wrong].lines} and ${counts[wrong].records}`;
}

/** The counting pass on two threads: SHA-256 here, the line counts in the pool's first thread. */
async function hashWhileCounting(
  pool: WorkerPool,
  path: string,
  size: number,
  ranges: ByteRange[],
  onBytes: (bytes: number) => void,
  cancelled: () => boolean,
): Promise<CountingPass> {
  const [hashed, counts] = await Promise.all([hashAndCount(path, size, [], true, onBytes, cancelled), pool.countLines(path, size, ranges)]);
  return { sha256: hashed.sha256, counts };
}
