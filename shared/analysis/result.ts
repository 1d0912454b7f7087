import { CheckResult } from './checks/check-result';
import { ColumnMapping } from './log/column-mapping';
import { LogProblem } from './log/log-problem';
import { AnalysisProfile, TestSelection } from './profile';
import { BlockSummary } from './report/block-summary';
import { ChshSummary } from './report/chsh-summary';
import { KeySummary } from './report/key-summary';
import { MissingRoundsSummary } from './report/missing-rounds';
import { QberSummary } from './report/qber-summary';
import { SecuritySummary } from './report/security-summary';
import { StationPairSummary } from './stations/station-pair-summary';
import { CountTable } from './tally/count-table';

/** The verdict on a run. */
export type Verdict = 'ACCEPT' | 'ABORT' | 'INVALID';

/** The file that was analysed. */
export interface InputSummary {
  /** SHA-256 of the file as given (compressed bytes for gzip), hex. */
  sha256: string;
  /** Size of the file as given. */
  bytes: number;
  /** Rounds (records) read. */
  rounds: number;
  /** `gzip` when the file began with the gzip magic bytes. */
  compression: 'none' | 'gzip';
  /** The column mapping used. */
  mapping: ColumnMapping;
}

/** How the test rounds were chosen, and how many. */
export interface SelectionSummary {
  mode: TestSelection['mode'];
  /** Test rounds. */
  testRounds: number;
  /** Generation (untested) rounds. */
  generationRounds: number;
}

/** The result of analysing one round log: what the API returns and the command line prints. */
export interface AnalysisResult {
  /** Version of the analysis rules. */
  engineVersion: string;
  input: InputSummary;
  /** The complete profile, defaults filled in. */
  profile: AnalysisProfile;
  /** The 256-bit selection seed, hex; null when the log's own marking chose the test rounds. */
  seed: string | null;
  /** Null for an INVALID log, as are counts, chsh, qber and key. */
  selection: SelectionSummary | null;
  /** The round indices the log lacks between its first and last; null for an INVALID log. */
  missingRounds: MissingRoundsSummary | null;
  counts: { test: CountTable; generation: CountTable } | null;
  chsh: ChshSummary | null;
  qber: QberSummary | null;
  key: KeySummary | null;
  /** The ε bookkeeping of the key figure and the checks' shared significance; null for an INVALID log. */
  security: SecuritySummary | null;
  checks: CheckResult[];
  blocks: BlockSummary[];
  verdict: Verdict;
  /** Why the run was aborted or is invalid (empty on ACCEPT). */
  reasons: string[];
  /** The first problems of an INVALID log. */
  errors: LogProblem[];
  /** All problems found. */
  errorCount: number;
  /**
   * Only for two station logs analysed as a pair: both files, their join, alignment and timing.
   * `input` then stands for the pair (see `analyseStationPair`).
   */
  stations?: StationPairSummary;
  /** SHA-256 of the canonical JSON of everything else (see `canonicalJson`). */
  fingerprint: string;
}

/** A result before its fingerprint is computed. */
export type UnsealedResult = Omit<AnalysisResult, 'fingerprint'>;
