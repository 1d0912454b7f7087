// The surface of the analysis engine for the API and the client: result and profile types, the
// profile and mapping validation, and the pure building blocks the client can run in a browser.
// The Node entry (files, gzip, threads, AES, fingerprint) is `shared/analysis/node`.
export type { CheckResult, CheckStatus } from './checks/check-result';
export { canonicalJson } from './canonical-json';
export { ENGINE_VERSION } from './engine-version';
export { OUTCOME_ENCODINGS, parseColumnMapping, columnMappingSchema } from './log/column-mapping';
export type { ColumnMapping, OutcomeEncoding, MappingParse } from './log/column-mapping';
export type { LogProblem } from './log/log-problem';
export { CHECK_FAMILIES, parseProfile, profileSchema } from './profile';
export type { AnalysisProfile, AnalysisProfileInput, CheckFamily, ProfileParse, TestSelection } from './profile';
export type { BlockSummary, FractionInterval } from './report/block-summary';
export type { ChshSummary, SettingPairFigures } from './report/chsh-summary';
export type { KeySummary } from './report/key-summary';
export type { MissingRoundsSummary } from './report/missing-rounds';
export type { QberSummary } from './report/qber-summary';
export type { EpsilonTerm, SecuritySummary } from './report/security-summary';
export type { AnalysisResult, InputSummary, SelectionSummary, UnsealedResult, Verdict } from './result';
export type { KeystreamSource } from './selection/keystream';
export type { CountTable } from './tally/count-table';
export { QUANTUM_WIN_FRACTION, LOCAL_WIN_FRACTION } from './statistics/bell-bounds';
export { asymptoticRate } from './statistics/asymptotic-rate';
export { binaryEntropy } from './statistics/binary-entropy';
export { finiteKeyLength } from './statistics/finite-key-length';
export { hoeffdingDeviation } from './statistics/hoeffding';
export { minEntropyPerRound } from './statistics/min-entropy';
export { samplingDeviation } from './statistics/sampling-deviation';
