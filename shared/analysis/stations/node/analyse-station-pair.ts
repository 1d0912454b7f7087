import { createHash } from 'node:crypto';
import { OutcomeEncoding } from '../../log/column-mapping';
import { LISTED_PROBLEMS, LogProblem } from '../../log/log-problem';
import { TriggerSpan } from '../../log/range-plans';
import { assembleResult, invalidResult, refusedResult, RunContext } from '../../report/assemble-result';
import { AnalysisResult, InputSummary, UnsealedResult } from '../../result';
import { aesKeystream } from '../../node/aes-keystream';
import { AnalysisRequestError } from '../../node/analysis-errors';
import { resolveRequest } from '../../node/analysis-request';
import { sealResult } from '../../node/fingerprint';
import { LogSource, sourceBytes } from '../../node/log-source';
import { decideAlignment } from '../alignment-decision';
import { JoinedBatch } from '../joined-round';
import { JoinedStreamAnalysis } from '../joined-stream-analysis';
import { scanOffsets } from '../offset-scan';
import { checkedStatedOffset, StatedOffset } from '../stated-offset';
import { Station } from '../station-columns';
import { StationGeometry } from '../station-geometry';
import { StationJoin, StationJoinSummary } from '../station-join';
import { alignmentSummary, StationFileSummary, stationFileSummary, StationPairSummary } from '../station-pair-summary';
import { pairTimingRefusal, spaceLikeFinding } from '../space-like-rule';
import { TimingCheck } from '../timing-check';
import { DigestingSource, FileDigest } from './file-digest';
import { readStationLog, StationLogReading } from './station-log-file';
import { readStationLogInThread } from './threaded-station-log';

/** Options of the analysis of two station logs; everything may be left out. */
export interface StationPairAnalysisOptions {
  /** The profile as written (validated here; defaults filled in). Its test rounds must be drawn from a seed. */
  profile?: unknown;
  /** How both logs write their outcomes; default `0/1`. */
  outcomes?: OutcomeEncoding;
  /** Selection seed, 64 hex digits; drawn from the OS CSPRNG when left out. */
  seed?: string;
  /** Pairs A's round r with B's round r + k, on the caller's word and with its reason; shown in the result. */
  statedOffset?: StatedOffset;
  /** Where the stations are: with it, and times in both logs, the result reports the timing check. */
  geometry?: StationGeometry;
  /** Station A's records the alignment check reads; default 10^6 (`ALIGNMENT_WINDOW_ROUNDS`). */
  alignmentWindowRounds?: number;
}

const STATIONS: readonly Station[] = ['A', 'B'];

/**
 * Analyses the two station logs of one night: the joined log the engine judges is the rounds both
 * stations recorded, over the trigger span of both records, so a round only one station recorded is
 * a missing round wherever it lies, the two ends included. Three passes over the logs, memory
 * independent of their length: (1) the join, with each file's SHA-256, what each side lacks and the
 * timing check; (2) the alignment check over station A's first 10^6 records; (3) the join again,
 * into the engine's record path; each file's SHA-256 is taken again and must not have changed.
 * Two files are read on two cores (`hashedReadings`).
 * A shift found by the alignment check makes the pair INVALID, with its sentence in `reasons`: the
 * records are never realigned silently; a stated offset is applied as given and shown. The timing
 * check, when the geometry and both logs' times allow it, is one of the run's checks; under a
 * profile that requires space-like separation it blocks, and a pair whose timing cannot be checked
 * is INVALID with a sentence naming what is missing. A stream source must be openable four times.
 * Rejects only with `AnalysisRequestError`.
 */
export async function analyseStationPair(a: LogSource, b: LogSource, options: StationPairAnalysisOptions = {}): Promise<AnalysisResult> {
  const outcomes = options.outcomes ?? '0/1';
  const request = resolveRequest(options.profile, { outcomes }, options.seed);
  if (request.profile.testSelection.mode === 'from-log') {
    throw new AnalysisRequestError('station logs carry no test marks: two station logs need test rounds drawn from a seed (fixed-fraction or bernoulli selection)', 'profile');
  }
  const statedOffset = asRequest(() => (options.statedOffset === undefined ? undefined : checkedStatedOffset(options.statedOffset)));
  const timing = asRequest(() => (options.geometry === undefined ? null : new TimingCheck(options.geometry)));
  const sources = { A: a, B: b };
  await Promise.all(STATIONS.map((station) => sourceBytes(sources[station])));

  const first = await joinPass(sources, outcomes, statedOffset, timing);
  const files = first.files;
  const withStations = (result: UnsealedResult, stations: StationPairSummary) => sealResult({ ...result, stations });
  const context: RunContext = { input: pairInput(files, first.join.joinedRounds, request.mapping), profile: request.profile, seed: request.seed };
  const problems = STATIONS.flatMap((station) => first.problems[station].map((problem) => ({ ...problem, message: `station ${station}'s log: ${problem.message}` })));
  if (problems.length > 0) {
    const count = files.reduce((total, file) => total + file.problemCount, 0);
    return withStations(invalidResult(problems.slice(0, LISTED_PROBLEMS), count, context), { files, join: null, alignment: null, timing: null });
  }
  const timingShown = timing !== null && files.every((file) => file.hasTimes) ? timing.summary() : null;
  const untimedStations = files.filter((file) => !file.hasTimes).map((file) => file.station);
  const timingRefusal = pairTimingRefusal(request.profile, { geometry: timing !== null, untimedStations });

  const scan = await scanOffsets(readStationLog(a, 'A', outcomes).rows, readStationLog(b, 'B', outcomes).rows, {
    centre: statedOffset?.rounds ?? 0,
    windowRounds: options.alignmentWindowRounds,
  });
  const alignment = alignmentSummary(decideAlignment(scan), scan.roundsRead);
  const stations: StationPairSummary = { files, join: first.join, alignment, timing: timingShown };
  const refusals = [...(timingRefusal === null ? [] : [timingRefusal]), ...(alignment.shifted ? [alignment.sentence] : [])];
  if (refusals.length > 0) {
    return withStations(refusedResult(refusals, [], 0, context), stations);
  }

  // Every record holds a row, so the span exists.
  const span = first.join.span as TriggerSpan;
  const keystream = request.seed === null ? null : aesKeystream(request.seed);
  const analysis = JoinedStreamAnalysis.start(request.profile, span, first.join.joinedRounds, keystream);
  if (!(analysis instanceof JoinedStreamAnalysis)) {
    return withStations(invalidResult([analysis], 1, context), stations);
  }
  const second = await joinPass(sources, outcomes, statedOffset, analysis);
  if (second.files.some((file, i) => file.sha256 !== files[i].sha256)) {
    throw new AnalysisRequestError('a station log changed while it was being analysed', 'io');
  }
  const summary = analysis.summary();
  const findings = timingShown === null ? [] : [spaceLikeFinding(timingShown, request.profile)];
  const result = summary.problemCount > 0 ? invalidResult(summary.problems, summary.problemCount, context) : assembleResult(summary, context, { span, findings });
  return withStations(result, stations);
}

/** One pass of the join over both logs, each hashed as stored, each batch of joined rounds handed to `consumer`. */
async function joinPass(
  sources: Record<Station, LogSource>,
  outcomes: OutcomeEncoding,
  statedOffset: StatedOffset | undefined,
  consumer: { add(rounds: JoinedBatch): void } | null,
): Promise<{ files: StationFileSummary[]; join: StationJoinSummary; problems: Record<Station, LogProblem[]> }> {
  const readings = hashedReadings(sources, outcomes);
  const join = new StationJoin(readings.A.rows, readings.B.rows, { statedOffset });
  for await (const batch of join.rounds()) consumer?.add(batch);
  const digests: FileDigest[] = await Promise.all(STATIONS.map((station) => readings[station].digest()));
  const files = STATIONS.map((station, i) => stationFileSummary(readings[station].summary(), { ...digests[i], compression: readings[station].compression() ?? 'none' }));
  return { files, join: join.summary(), problems: { A: readings.A.summary().problems, B: readings.B.summary().problems } };
}

/** A station log's reading with its file's digest (once the rows are read). */
type HashedReading = StationLogReading & { digest(): Promise<FileDigest> };

/**
 * Both logs read and hashed in one reading each. Two files: station B's is read and hashed in a
 * thread of its own, so the join reads both on two cores. A stream is read and hashed here.
 */
function hashedReadings(sources: Record<Station, LogSource>, outcomes: OutcomeEncoding): Record<Station, HashedReading> {
  const here = (source: LogSource, station: Station): HashedReading => {
    const digesting = new DigestingSource(source);
    return { ...readStationLog(digesting.tapped, station, outcomes), digest: () => digesting.digest() };
  };
  const { A: a, B: b } = sources;
  return { A: here(a, 'A'), B: 'path' in a && 'path' in b ? readStationLogInThread(b.path, 'B', outcomes) : here(b, 'B') };
}

/**
 * What the result's `input` says of a pair: the SHA-256 of the two files' digests (hex, station A's
 * then B's, each ending in a line feed), so one value names both files; their bytes together; the
 * joined rounds; gzip when either file is. Each file's own figures are in `stations.files`.
 */
function pairInput(files: readonly StationFileSummary[], joinedRounds: number, mapping: InputSummary['mapping']): InputSummary {
  const sha256 = stationPairDigest(files[0].sha256, files[1].sha256);
  const bytes = files.reduce((total, file) => total + file.bytes, 0);
  const compression = files.some((file) => file.compression === 'gzip') ? 'gzip' : 'none';
  return { sha256, bytes, rounds: joinedRounds, compression, mapping };
}

/** The one SHA-256 that names two station logs: of station A's digest then B's, hex, each ending in a line feed. */
export function stationPairDigest(stationASha256: string, stationBSha256: string): string {
  return createHash('sha256').update(`${stationASha256}\n${stationBSha256}\n`).digest('hex');
}

/** Runs a check of the caller's stated offset or geometry, its RangeError becoming a request error. */
function asRequest<T>(check: () => T): T {
  try {
    return check();
  } catch (error) {
    if (error instanceof RangeError) throw new AnalysisRequestError(error.message, 'stations');
    throw error;
  }
}
