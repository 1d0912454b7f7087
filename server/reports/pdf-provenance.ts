import { type AnalysisResult, ROUND_FIELDS } from '@shared/analysis';
import type { RunReportDto } from '@shared/api';
import { mappingWords } from '@shared/format/mapping-words';
import { describeProfile } from '@shared/format/profile-field-labels';
import { formatCount } from '@shared/format/numbers';
import { fields, type Field } from './pdf-blocks';
import { formatInstant } from './pdf-dates';

/**
 * Everything needed to re-derive the result from the archived log: the file, how it was read, the
 * seed and selection, the complete profile as applied (each field by the label and words the app
 * shows it with), the engine and the result's digest.
 */
export function writeProvenance(doc: PDFKit.PDFDocument, report: RunReportDto): void {
  const { result, run, profile } = report;
  const { selection } = result;
  fields(doc, [
    ...(result.stations ? pairInputRows(report) : fileRows(report)),
    { label: 'Column mapping', value: mappingLine(result) },
    { label: 'Selection seed', value: report.seed, mono: true },
    { label: 'Test-round selection', value: selectionLine(result) },
    ...(selection === null
      ? []
      : [{ label: 'Test and generation rounds', value: `${formatCount(selection.testRounds)} test, ${formatCount(selection.generationRounds)} generation` }]),
    { label: 'Acceptance profile', value: `${profile.name}, version ${profile.version} (profile ${profile.profileId}, version record ${profile.versionId})` },
    ...describeProfile(result.profile).map(({ label, value }): Field => ({ label: `  ${label}`, value })),
    { label: 'Engine version', value: result.engineVersion },
    { label: 'Result digest', value: result.fingerprint, mono: true },
    { label: 'Uploaded', value: formatInstant(run.createdAt) },
    { label: 'Analysis finished', value: formatInstant(run.finishedAt) },
    ...(run.duplicateOf === null ? [] : [{ label: 'Same bytes as', value: `run ${run.duplicateOf}` }]),
  ]);
}

/** The one log the run read. */
function fileRows({ run, result: { input } }: RunReportDto): Field[] {
  return [
    { label: 'File', value: run.originalName },
    { label: 'File SHA-256', value: input.sha256, mono: true },
    { label: 'Size', value: `${formatCount(input.bytes)} bytes, ${input.compression === 'gzip' ? 'gzip-compressed' : 'not compressed'}` },
    { label: 'Rounds read', value: formatCount(input.rounds) },
  ];
}

/** The two station logs the run read, named by one digest of both (each file's own is under Two station logs). */
function pairInputRows({ run, stations, result: { input } }: RunReportDto): Field[] {
  return [
    { label: 'Station logs', value: `A: ${run.originalName} · B: ${stations?.stationB.originalName ?? 'name not recorded'}` },
    { label: 'SHA-256 of the pair', value: input.sha256, mono: true },
    { label: '', value: "the SHA-256 of station A's SHA-256 then station B's, hex, each followed by a line feed" },
    { label: 'Size', value: `${formatCount(input.bytes)} bytes in both files${input.compression === 'gzip' ? ', gzip-compressed in part or whole' : ', not compressed'}` },
    { label: 'Rounds joined', value: formatCount(input.rounds) },
  ];
}

/**
 * The columns the analysis read, by their header names. The `test` column is named only when the
 * profile takes the log's own marks, the one case where a log must have it.
 */
function mappingLine(result: AnalysisResult): string {
  const { mapping } = result.input;
  const read = ROUND_FIELDS.filter((field) => field !== 'test' || result.profile.testSelection.mode === 'from-log');
  return mappingWords(mapping, read);
}

/** How the test rounds were chosen, in words. */
function selectionLine(result: AnalysisResult): string {
  const selection = result.profile.testSelection;
  if (selection.mode === 'from-log') return "from-log: the log's own test column marked the test rounds (the seed is not used)";
  if (selection.mode === 'fixed-fraction') return `fixed-fraction: exactly ⌊${selection.fraction}·N⌋ rounds, drawn from the seed`;
  return `bernoulli: each round tested with probability ${selection.probability}, drawn from the seed`;
}
