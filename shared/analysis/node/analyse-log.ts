import { open } from 'node:fs/promises';
import { HEAD_BYTES } from '../log/log-head';
import { assembleResult, invalidResult, refusedResult, RunContext } from '../report/assemble-result';
import { AnalysisResult } from '../result';
import { joinedLogTimingRefusal } from '../stations/space-like-rule';
import { AnalysisCancelledError, AnalysisRequestError } from './analysis-errors';
import { ProgressListener } from './analysis-progress';
import { resolveRequest } from './analysis-request';
import { sealResult } from './fingerprint';
import { LogSource, sourceBytes } from './log-source';
import { StoredCensus } from './census-ranges';
import { readByRanges, threadsFor } from './ranged-reading';
import { ReadOutcome } from './read-outcome';
import { readWithCsvParse } from './reference-reading';
import { readAsStream } from './streamed-reading';

/** Options of one analysis; everything may be left out. */
export interface AnalyseOptions {
  /** The profile as written (validated here; defaults filled in). */
  profile?: unknown;
  /** The column mapping as written. */
  mapping?: unknown;
  /** Selection seed, 64 hex digits; drawn from the OS CSPRNG when left out. */
  seed?: string;
  /** Threads for a plain file; default both cores for files of 16 MiB and more, else one. */
  threads?: number;
  /**
   * `fast` (default): the byte scanner with the row kernel; `scanner`: the byte scanner alone;
   * `reference`: csv-parse. The last two are for checking the fast reader and for the benchmark.
   */
  reader?: 'fast' | 'scanner' | 'reference';
  /** Hears of progress, bytes read of total, per pass (fast reader). */
  onProgress?: ProgressListener;
  /** Cancels the analysis; the promise then rejects with `AnalysisCancelledError`. */
  signal?: AbortSignal;
  /**
   * The census taken when the log was uploaded: the analysis is then one pass (plain files read by
   * two threads or more, gzip files and streams). It is checked against the bytes; one that does not fit is told to
   * `onCensusMismatch` and the log is read again with a counting pass (same result either way).
   */
  census?: StoredCensus;
  onCensusMismatch?: (reason: string) => void;
}

const GZIP_MAGIC = [0x1f, 0x8b];

/**
 * Analyses a round log: a counting pass, then one analysis pass, memory independent of the number
 * of rounds. Resolves to the sealed result (ACCEPT, ABORT or INVALID); rejects only with
 * `AnalysisRequestError` (bad profile, mapping or seed; unreadable file) or `AnalysisCancelledError`.
 * Under a profile that requires space-like separation a readable log is INVALID, with the sentence
 * why: one joined log holds no times to show it.
 */
export async function analyseLog(source: LogSource, options: AnalyseOptions = {}): Promise<AnalysisResult> {
  const request = resolveRequest(options.profile, options.mapping, options.seed, options.reader !== 'scanner');
  const cancelled = () => options.signal?.aborted === true;
  const totalBytes = await sourceBytes(source);
  const outcome = await withIoErrors(source, async (): Promise<ReadOutcome> => {
    if (options.reader === 'reference') {
      return readWithCsvParse(source, request);
    }
    const head = 'path' in source && totalBytes !== null ? await readHead(source.path) : null;
    const census = options.census && { stored: options.census, onMismatch: options.onCensusMismatch ?? (() => undefined) };
    if (head !== null && totalBytes !== null && 'path' in source && !GZIP_MAGIC.every((byte, i) => head[i] === byte)) {
      return readByRanges(source.path, totalBytes, head, request, threadsFor(totalBytes, options.threads), options.onProgress, options.signal, census);
    }
    return readAsStream(source, totalBytes, request, options.onProgress, cancelled, census);
  });
  if (cancelled()) {
    throw new AnalysisCancelledError();
  }
  const context: RunContext = { input: { ...outcome.input, mapping: request.mapping }, profile: request.profile, seed: request.seed };
  if (outcome.kind === 'unreadable') {
    return sealResult(invalidResult(outcome.problems, outcome.problemCount, context));
  }
  const { summary } = outcome;
  if (summary.problemCount > 0) {
    return sealResult(invalidResult(summary.problems, summary.problemCount, context));
  }
  const timingRefusal = joinedLogTimingRefusal(request.profile);
  return sealResult(timingRefusal === null ? assembleResult(summary, context) : refusedResult([timingRefusal], [], 0, context));
}

/** The first bytes of a file. */
async function readHead(path: string): Promise<Uint8Array> {
  const file = await open(path, 'r');
  try {
    const buffer = Buffer.alloc(HEAD_BYTES);
    const { bytesRead } = await file.read(buffer, 0, HEAD_BYTES, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await file.close();
  }
}

/** Runs the reading, turning file-system errors into request errors with the path named. */
async function withIoErrors(source: LogSource, read: () => Promise<ReadOutcome>): Promise<ReadOutcome> {
  try {
    return await read();
  } catch (error) {
    throw readingError(source, error);
  }
}

/** What to throw for an error met while reading `source`: a file-system error becomes a request error naming the file. */
export function readingError(source: LogSource, error: unknown): unknown {
  if (error instanceof AnalysisCancelledError || error instanceof AnalysisRequestError) {
    return error;
  }
  if ((error as NodeJS.ErrnoException).syscall !== undefined) {
    const name = 'path' in source ? source.path : 'the log stream';
    return new AnalysisRequestError(`cannot read ${name}: ${(error as Error).message}`, 'io');
  }
  return error;
}
