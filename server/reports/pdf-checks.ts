import type { AnalysisResult, CheckResult, CheckStatus } from '@shared/analysis';
import { formatPValue } from '@shared/format/numbers';
import { formatScientific } from '@shared/format/numbers';
import { checkLabel } from '@shared/format/check-labels';
import { grid, paragraph, type GridCell } from './pdf-blocks';
import { TONE, TYPE } from './pdf-style';

/** Each outcome as a word in its tone: the word carries the meaning, the tone only repeats it. */
const OUTCOME: Record<CheckStatus, GridCell> = {
  pass: { text: 'pass', colour: TONE.accept },
  warn: { text: 'warning', font: 'bold', colour: TONE.threshold },
  fail: { text: 'FAIL', font: 'bold', colour: TONE.abort },
};

/** Every statistical test of the log: its label, its outcome, its p-value against its threshold, and the sentence saying what was found. */
export function writeChecks(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  if (result.checks.length === 0) {
    paragraph(doc, 'No checks were run: the log could not be analysed.', { colour: TONE.muted });
    return;
  }
  grid(
    doc,
    [
      // Widths in points of the A4 column: the longest test's label, "warning" and "3.2e-1235" each on one line.
      { header: 'Test', width: 138 },
      { header: 'Outcome', width: 52 },
      { header: 'p-value', width: 54, align: 'right' },
      { header: 'What was found', width: 255 },
    ],
    result.checks.map((check) => [checkLabel(check.id), OUTCOME[check.status], pValueCell(check), check.message]),
  );
  paragraph(doc, thresholdSentence(result), { size: TYPE.small, colour: TONE.muted });
}

/** The threshold every statistical check's p-value is held against, and how p-values are computed. */
function thresholdSentence(result: AnalysisResult): string {
  // Results stored before engine 2.0 have neither `security` nor log-space p-values.
  const sharing = result.security?.checks;
  if (!sharing) return 'This result was stored before engine 2.0, which kept no p-values apart: each check’s sentence gives its own.';
  return (
    `Each statistical test passes at p\u00a0≥ α/k = ${formatScientific(sharing.significance)}/${sharing.count} = ${formatScientific(sharing.perCheck)} (see Security parameters). ` +
    'p-values are computed in log space, so a tail below the smallest double still reads as a number; a dash marks a test that counts rather than weighs a p-value.'
  );
}

/**
 * The p-value from its log10, on one line (a second line would interleave with the sentence's when
 * the PDF's text is read back); a dash for a counting check or a result stored before engine 2.0.
 */
function pValueCell(check: CheckResult): GridCell {
  return typeof check.log10PValue === 'number' ? formatPValue(check.log10PValue) : { text: '–', colour: TONE.muted };
}
