// The engine's public entry for the app and the server: the result and profile types, the
// statistics and report words the screens, mails and PDFs show, and the log-reading pieces the
// upload preview and the API use. The Node side (analyseLog, the census, the keystream) is
// `@shared/analysis/node`. The engine's own modules and its specs import each other directly.
export { canonicalJson } from './canonical-json';
export type { CheckResult, CheckStatus } from './checks/check-result';
export { generalAttackKeyLength, KeyLengthInputError } from './entropy-accumulation';
export type { GeneralAttackRequest } from './entropy-accumulation';
export { headerNameOf, OUTCOME_ENCODINGS, parseColumnMapping } from './log/column-mapping';
export type { ColumnMapping, OutcomeEncoding } from './log/column-mapping';
export { splitCsvLine } from './log/csv-line';
export { parseIntegerField } from './log/integer-field';
export { LogCensusTaker } from './log/log-census';
export type { LogCensus } from './log/log-census';
export { HEAD_BYTES, readLogHead } from './log/log-head';
export { ProblemList } from './log/log-problem';
export { RecordChecker } from './log/record-checker';
export { FIELD_MEANING, ROUND_FIELDS } from './log/round-fields';
export type { RoundField } from './log/round-fields';
export { CHECK_FAMILIES, parseProfile, profileSchema } from './profile';
export type { AnalysisProfile, AnalysisProfileInput, CheckFamily, TestSelection } from './profile';
export type { BlockSummary, FractionInterval } from './report/block-summary';
export { summariseChsh } from './report/chsh-summary';
export type { ChshSummary } from './report/chsh-summary';
export { criteriaTable } from './report/criteria-table';
export { generalKeySentence } from './report/general-key-words';
export type { KeySummary } from './report/key-summary';
export { missingRoundsState, missingShareText, shareText } from './report/missing-rounds';
export type { MissingRoundsState, MissingRoundsSummary } from './report/missing-rounds';
export { summariseSecurity } from './report/security-summary';
export type { SecuritySummary } from './report/security-summary';
export { expectedSiftedProtocol } from './report/sifted-protocol';
export { winThresholdOf } from './report/win-threshold';
export type { AnalysisResult, Verdict } from './result';
export { LOCAL_CHSH_VALUE, LOCAL_WIN_FRACTION, QUANTUM_CHSH_VALUE, QUANTUM_WIN_FRACTION } from './statistics/bell-bounds';
export { chshValueFromWinFraction, winFractionFromChshValue } from './statistics/chsh-value';
export { hoeffdingDeviation } from './statistics/hoeffding';
export { COUNT_CELLS, countCell } from './tally/count-table';
export type { CountTable } from './tally/count-table';
export {
  alignmentSentence,
  lightTime,
  marginText,
  signedRounds,
  SPEED_OF_LIGHT_M_PER_S,
  STATION_COLUMNS,
  STATION_MAPPING_RULE,
  stationLogOutcomes,
  StationLogReader,
} from './stations';
export type {
  AlignmentPoint,
  AlignmentSummary,
  MarginBin,
  SmallestMargin,
  StationFileSummary,
  StationGeometry,
  StationJoinSummary,
  StationLogSummary,
  StationPairSummary,
  TimingSummary,
} from './stations';
