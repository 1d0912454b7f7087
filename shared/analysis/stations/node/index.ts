// Two stations, two logs: reading a station log from a file or stream, plain or gzip (Node only).
export { readStationLog } from './station-log-file';
export type { StationLogReading } from './station-log-file';
export { analyseStationPair, stationPairDigest } from './analyse-station-pair';
export type { StationPairAnalysisOptions } from './analyse-station-pair';
