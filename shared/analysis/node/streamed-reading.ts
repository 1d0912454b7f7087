import { createHash } from 'node:crypto';
import { ByteScanner } from '../log/byte-scanner';
import { HEAD_BYTES, LogHead, readLogHead } from '../log/log-head';
import { LineCounter } from '../log/line-counter';
import { RangeAnalysis } from '../log/range-analysis';
import { planRanges, spanProblem, triggerSpan } from '../log/range-plans';
import { firstRecordLine, LastLineKeeper, roundOfLine } from '../log/record-edges';
import { aesKeystream } from './aes-keystream';
import { AnalysisRequest } from './analysis-request';
import { progressCounter, ProgressListener } from './analysis-progress';
import { DamagedGzipError, decodeLog } from './decoded-log';
import { LogSource, openSource } from './log-source';
import { NO_ROUNDS, ReadOutcome } from './read-outcome';

/**
 * Reads a log as a stream, in order, in the caller's thread: gzip files (which cannot be split)
 * and streams. The counting pass hashes the raw bytes, keeps the head and counts the lines; the
 * analysis pass decodes again and scans everything after the header.
 */
export async function readAsStream(source: LogSource, totalBytes: number | null, request: AnalysisRequest, listener: ProgressListener | undefined, cancelled: () => boolean): Promise<ReadOutcome> {
  const hash = createHash('sha256');
  let bytes = 0;
  const countProgress = progressCounter('counting', totalBytes, listener);
  const counting = await decodeLog(openSource(source), (chunk) => {
    hash.update(chunk);
    bytes += chunk.length;
    countProgress(chunk.length);
  });
  const compression = counting.gzip ? ('gzip' as const) : ('none' as const);
  const counter = new LineCounter();
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
  const scanner = new ByteScanner(logHead.layout, analysis, plan.firstLine);
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
