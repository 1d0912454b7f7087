import type { PipelineMeasurement } from './measure-pipeline';

/** The targets on this machine: upload to verdict by archive, and the peak memory of each process. */
export const TARGETS = { totalSeconds: { local: 12, s3: 30 }, peakMB: 300 } as const;

const COLUMNS: Array<[string, (m: PipelineMeasurement) => string]> = [
  ['storage', (m) => m.storage],
  ['log MB', (m) => (m.logBytes / 1e6).toFixed(0)],
  ['upload s', (m) => m.uploadSeconds.toFixed(1)],
  ['201→verdict s', (m) => m.verdictSeconds.toFixed(1)],
  ['= to reading', (m) => stage(m.stages.toReadingSeconds)],
  ['+ reading', (m) => stage(m.stages.readingSeconds)],
  ['queue s', (m) => m.queueSeconds.toFixed(1)],
  ['analysis s', (m) => m.analysisSeconds.toFixed(1)],
  ['total s', (m) => `${m.totalSeconds.toFixed(1)}${mark(m.totalSeconds <= TARGETS.totalSeconds[m.storage])}`],
  ['API peak MB', (m) => `${m.apiPeakMB.toFixed(0)}${mark(m.apiPeakMB <= TARGETS.peakMB)} (${m.apiStartedMB.toFixed(0)})`],
  ['worker peak MB', (m) => `${m.workerPeakMB.toFixed(0)}${mark(m.workerPeakMB <= TARGETS.peakMB)} (${m.workerStartedMB.toFixed(0)})`],
  ['verdict', (m) => m.verdict ?? m.state],
];

/** The measurements as an aligned table, a `*` marking each figure that misses its target. */
export function pipelineTable(measurements: PipelineMeasurement[]): string {
  const rows = [COLUMNS.map(([title]) => title), ...measurements.map((m) => COLUMNS.map(([, cell]) => cell(m)))];
  const widths = COLUMNS.map((_, column) => Math.max(...rows.map((row) => row[column].length)));
  const lines = rows.map((row) => row.map((cell, column) => (column === 0 ? cell.padEnd(widths[column]) : cell.padStart(widths[column]))).join('  '));
  lines.push(
    "to reading: the queue, and with S3 the working copy; reading: the engine, to the stored verdict; queue, analysis: from the run's own times; (MB): at start, before the upload",
  );
  lines.push(
    `targets: upload to verdict (total) under ${TARGETS.totalSeconds.local} s with the local archive and ${TARGETS.totalSeconds.s3} s with S3, each process under ${TARGETS.peakMB} MB; * = missed`,
  );
  return lines.join('\n');
}

function stage(seconds: number | null): string {
  return seconds === null ? '-' : seconds.toFixed(1);
}

function mark(met: boolean): string {
  return met ? ' ' : '*';
}
