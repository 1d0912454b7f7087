import { AlignmentDecision } from './alignment-decision';
import { alignmentSentence } from './alignment-words';
import { Station } from './station-columns';
import { StationJoinSummary } from './station-join';
import { StationLogSummary } from './station-log-reader';
import { TimingSummary } from './timing-check';

/** One station's log as it was read. */
export interface StationFileSummary {
  station: Station;
  /** SHA-256 of the file as given (compressed bytes for gzip), hex. */
  sha256: string;
  /** Size of the file as given. */
  bytes: number;
  /** `gzip` when the file began with the gzip magic bytes. */
  compression: 'none' | 'gzip';
  /** Records (non-blank lines after the header) read, and the valid rounds among them. */
  records: number;
  rounds: number;
  /** The first and last round index of the log as written (B's not moved by a stated offset), or null. */
  firstRound: number | null;
  lastRound: number | null;
  /** Whether the log has the two time columns. */
  hasTimes: boolean;
  /** All problems of the log; any makes the pair INVALID (the first are the result's `errors`). */
  problemCount: number;
}

/** One pairing of the alignment check, for a chart: S and where |S| lies (all pairings at once, 1 − α). */
export interface AlignmentPoint {
  /** k: A's round r paired with B's round r + k. */
  offset: number;
  chshValue: number | null;
  lower: number;
  upper: number;
}

/** The alignment check as a result shows it. */
export interface AlignmentSummary {
  /** The offset the others were compared with: the stated offset, or 0. */
  centre: number;
  /** α of the rule. */
  significance: number;
  /** Station A's records the scan read. */
  roundsRead: number;
  /** Whether another offset fits clearly better than the centre: the pair is then INVALID. */
  shifted: boolean;
  /** The best other offset. */
  bestOffset: number;
  /** What the check found, in a sentence. */
  sentence: string;
  /** Every pairing, in increasing offset. */
  series: AlignmentPoint[];
}

/** What a result of two station logs adds: both files, their join, their alignment and their timing. */
export interface StationPairSummary {
  /** Station A's log, then station B's. */
  files: StationFileSummary[];
  /** The join (null when a log could not be read). */
  join: StationJoinSummary | null;
  /** The alignment check (null when a log could not be read). */
  alignment: AlignmentSummary | null;
  /**
   * The timing check, when both logs have times and the stations' geometry was given; else null.
   * Its outcome is also the run's `space-like-separation` check, which blocks ACCEPT only under a
   * profile that requires space-like separation (`spaceLikeSeparation`).
   */
  timing: TimingSummary | null;
}

/** A station log's entry from its reading and its bytes. */
export function stationFileSummary(reading: StationLogSummary, file: { sha256: string; bytes: number; compression: 'none' | 'gzip' }): StationFileSummary {
  return {
    station: reading.station,
    ...file,
    records: reading.records,
    rounds: reading.rows,
    firstRound: reading.firstRound,
    lastRound: reading.lastRound,
    hasTimes: reading.layout?.hasTimes ?? false,
    problemCount: reading.problemCount,
  };
}

/** The alignment decision as a result shows it (the deviations left out: one is infinite without rounds). */
export function alignmentSummary(decision: AlignmentDecision, roundsRead: number): AlignmentSummary {
  return {
    centre: decision.centre,
    significance: decision.significance,
    roundsRead,
    shifted: decision.shifted,
    bestOffset: decision.best.offset,
    sentence: alignmentSentence(decision),
    series: decision.series.map(({ offset, chshValue, lower, upper }) => ({ offset, chshValue, lower, upper })),
  };
}
