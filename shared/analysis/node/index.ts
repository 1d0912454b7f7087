export { analyseLog } from './analyse-log';
export type { AnalyseOptions } from './analyse-log';
export { AnalysisCancelledError, AnalysisRequestError } from './analysis-errors';
export type { AnalysisProgress, ProgressListener } from './analysis-progress';
export type { LogSource } from './log-source';
export type { StoredCensus } from './census-ranges';
export { resultFingerprint } from './fingerprint';
export { ENGINE_MALLOC_TUNABLES, withEngineMemory } from './engine-memory';
