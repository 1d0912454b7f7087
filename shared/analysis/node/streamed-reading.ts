import { createHash } from 'node:crypto';
import { ByteScanner } from '../log/byte-scanner';
import { HEAD_BYTES, LogHead, readLogHead } from '../log/log-head';
import { censusLastLine } from '../log/log-census';
import { RangeAnalysis } from '../log/range-analysis';
import { planRanges, spanProblem, triggerSpan } from '../log/range-plans';
import { firstRecordLine, LastLineKeeper, roundOfLine } from '../log/record-edges';
import { aesKeystream } from './aes-keystream';
import { createRowKernel } from './wasm-row-kernel';
import { AnalysisRequest } from './analysis-request';
import { progressCounter, ProgressListener } from './analysis-progress';
import { DamagedGzipError, decodeLog } from './decoded-log';
import { LogSource, openSource } from './log-source';
import { NO_ROUNDS, ReadOutcome } from './read-outcome';
import type { CensusUse } from './ranged-reading';
import { createLineCounter } from './wasm-line-counter';

/**
 * Reads a log as a stream, in order, in the caller's thread: gzip files (which cannot be split)
 * and streams. With a census taken at upload, one pass (see `readOnceWithCensus`); otherwise, or
 * when the census does not fit, two: the counting pass hashes the raw bytes, keeps the head and
 * counts the lines; the analysis pass decodes again and scans everything after the header.
 */
export async function readAsStream(
  source: LogSource,
  totalBytes: number | null,
  request: AnalysisRequest,
  listener: ProgressListener | undefined,
  cancelled: () => boolean,
  census?: CensusUse,
): Promise<ReadOutcome> {
  const once = census ? await readOnceWithCensus(source, totalBytes, request, listener, cancelled, census) : null;
  if (once !== null) return once;
  const hash = createHash('sha256');
  let bytes = 0;
  const countProgress = progressCounter('counting', totalBytes, listener);
  const counting = await decodeLog(openSource(source), (chunk) => {
    hash.update(chunk);
    bytes += chunk.length;
    countProgress(chunk.length);
  });
  const compression = counting.gzip ? ('gzip' as const) : ('none' as const);
  const counter = createLineCounter();
  const lastLine = new LastLineKeeper();
  const head = new Uint8Array(HEAD_BYTES);
  let headLength = 0;
  try {
    for await (const chunk of counting.chunks) {
      if (headLength < HEAD_BYTES) {
        const taken = chunk.subarray(0, HEAD_BYTES - headLength);
        head.set(taken, headLength);
        headLength += taken.length;
      }
      counter.push(chunk);
      lastLine.push(chunk);
      if (cancelled()) {
        break;
      }
    }
  } catch (error) {
    if (!(error instanceof DamagedGzipError)) {
      throw error;
    }
    const problem = { line: counter.finish().lines + 1, column: null, value: null, message: error.message };
    return { kind: 'unreadable', input: { sha256: hash.digest('hex'), bytes, rounds: 0, compression }, problems: [problem], problemCount: 1 };
  }
  const total = counter.finish();
  const decodedBytes = headLength;
  const logHead: LogHead = readLogHead(head.subarray(0, decodedBytes), decodedBytes < HEAD_BYTES, request.mapping, request.profile.testSelection.mode === 'from-log');
  const input = { sha256: hash.digest('hex'), bytes, rounds: Math.max(total.records - 1, 0), compression };
  if (!logHead.ok) {
    return { kind: 'unreadable', input, problems: [logHead.problem], problemCount: 1 };
  }
  if (input.rounds === 0) {
    return { kind: 'unreadable', input, problems: [NO_ROUNDS], problemCount: 1 };
  }
  const dataCount = { lines: total.lines - 1, records: input.rounds };
  const edges = {
    firstRound: roundOfLine(firstRecordLine(head.subarray(logHead.dataOffset, decodedBytes)), logHead.layout),
    lastRound: roundOfLine(lastLine.finish(), logHead.layout),
    previousRounds: [NaN],
  };
  const badSpan = spanProblem(triggerSpan(edges, input.rounds), input.rounds, logHead.layout);
  if (badSpan !== null) {
    return { kind: 'unreadable', input, problems: [badSpan], problemCount: 1 };
  }
  const [plan] = planRanges(logHead.layout, request.profile, [dataCount], edges);
  const analysis = new RangeAnalysis(plan, request.seed === null ? null : aesKeystream(request.seed));
  const scanner = new ByteScanner(logHead.layout, analysis, plan.firstLine, request.rowKernel ? createRowKernel(logHead.layout) : null);
  const analyseProgress = progressCounter('analysing', totalBytes, listener);
  const analysing = await decodeLog(openSource(source), (chunk) => analyseProgress(chunk.length));
  let skip = logHead.dataOffset;
  for await (const chunk of analysing.chunks) {
    const data = skip > 0 ? chunk.subarray(Math.min(skip, chunk.length)) : chunk;
    skip -= chunk.length - data.length;
    if (data.length > 0) {
      scanner.push(data);
    }
    if (cancelled()) {
      break;
    }
  }
  scanner.finish();
  return { kind: 'read', input, summary: analysis.summary() };
}

/**
 * One pass with the census: the raw bytes are hashed and decoded once (gzip decompression in
 * libuv's threads beside the scanner), the counts and the last round index taken from the census
 * so the selection and the blocks can start at the first round. Afterwards the census is checked
 * against what was read (the hash, the decoded bytes, lines, records and the last line); null
 * when it does not fit (told to `onMismatch`) or the log is refused before its rounds (no census
 * needed for that), so the caller reads the log with two passes.
 */
async function readOnceWithCensus(
  source: LogSource,
  totalBytes: number | null,
  request: AnalysisRequest,
  listener: ProgressListener | undefined,
  cancelled: () => boolean,
  { stored, onMismatch }: CensusUse,
): Promise<ReadOutcome | null> {
  const { census } = stored;
  const rounds = census.records - 1;
  const lastLine = censusLastLine(census);
  if (rounds < 1 || lastLine === null) return null;
  const hash = createHash('sha256');
  let bytes = 0;
  const progress = progressCounter('analysing', totalBytes, listener);
  const decoded = await decodeLog(openSource(source), (chunk) => {
    hash.update(chunk);
    bytes += chunk.length;
    progress(chunk.length);
  });
  const chunks: AsyncIterator<Uint8Array, unknown> = decoded.chunks[Symbol.asyncIterator]();
  const early: Uint8Array[] = [];
  let headLength = 0;
  let ended = false;
  try {
    while (headLength < HEAD_BYTES && !ended) {
      const next = await chunks.next();
      if (next.done === true) {
        ended = true;
      } else {
        early.push(next.value);
        headLength += next.value.length;
      }
    }
  } catch (error) {
    if (error instanceof DamagedGzipError) return null;
    throw error;
  }
  const head = Buffer.concat(early).subarray(0, HEAD_BYTES);
  const logHead = readLogHead(head, ended && headLength < HEAD_BYTES, request.mapping, request.profile.testSelection.mode === 'from-log');
  const edges = logHead.ok && {
    firstRound: roundOfLine(firstRecordLine(head.subarray(logHead.dataOffset)), logHead.layout),
    lastRound: roundOfLine(lastLine, logHead.layout),
    previousRounds: [NaN],
  };
  if (!logHead.ok || !edges || spanProblem(triggerSpan(edges, rounds), rounds, logHead.layout) !== null) {
    await chunks.return?.();
    return null;
  }
  const [plan] = planRanges(logHead.layout, request.profile, [{ lines: census.lines - 1, records: rounds }], edges);
  const analysis = new RangeAnalysis(plan, request.seed === null ? null : aesKeystream(request.seed));
  const scanner = new ByteScanner(logHead.layout, analysis, plan.firstLine, request.rowKernel ? createRowKernel(logHead.layout) : null);
  const keeper = new LastLineKeeper();
  let decodedBytes = 0;
  let skip = logHead.dataOffset;
  const take = (chunk: Uint8Array) => {
    decodedBytes += chunk.length;
    keeper.push(chunk);
    const data = skip > 0 ? chunk.subarray(Math.min(skip, chunk.length)) : chunk;
    skip -= chunk.length - data.length;
    if (data.length > 0) scanner.push(data);
  };
  try {
    early.forEach(take);
    for (let next = await chunks.next(); !next.done && !cancelled(); next = await chunks.next()) take(next.value);
  } catch (error) {
    if (error instanceof DamagedGzipError) return null;
    throw error;
  }
  scanner.finish();
  const summary = analysis.summary();
  const sha256 = hash.digest('hex');
  const input = { sha256, bytes, rounds, compression: decoded.gzip ? ('gzip' as const) : ('none' as const) };
  if (cancelled()) return { kind: 'read', input, summary };
  const read = { decodedBytes, lines: scanner.nextLine - plan.firstLine + 1, records: summary.records + 1, lastLine: keeper.finish() };
  const misfit =
    sha256 !== stored.sha256
      ? `it was taken of bytes hashing to ${stored.sha256}, the log hashes to ${sha256}`
      : read.decodedBytes !== census.decodedBytes || read.lines !== census.lines || read.records !== census.records
        ? `the log holds ${read.decodedBytes} bytes of text, ${read.lines} lines and ${read.records} records, the census says ${census.decodedBytes}, ${census.lines} and ${census.records}`
        : !sameBytes(read.lastLine, lastLine)
          ? "its last line is not the log's"
          : null;
  if (misfit === null) return { kind: 'read', input, summary };
  onMismatch(misfit);
  return null;
}

function sameBytes(a: Uint8Array | null, b: Uint8Array): boolean {
  return a !== null && a.length === b.length && a.every((byte, i) => byte === b[i]);
}
