import type { CheckStatus } from '../../shared/analysis/checks/check-result';
import type { AnalysisResult } from '../../shared/analysis/result';
import { grid, paragraph, type GridCell } from './pdf-blocks';
import { TONE } from './pdf-style';

/** Each outcome as a word in its tone: the word carries the meaning, the tone only repeats it. */
const OUTCOME: Record<CheckStatus, GridCell> = {
  pass: { text: 'pass', colour: TONE.accept },
  warn: { text: 'warning', font: 'bold', colour: TONE.threshold },
  fail: { text: 'FAIL', font: 'bold', colour: TONE.abort },
};

/** Every check of the run: its name, its outcome and the sentence saying what was found. */
export function writeChecks(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  if (result.checks.length === 0) {
    paragraph(doc, 'No checks were run: the log could not be analysed.', { colour: TONE.muted });
    return;
  }
  grid(
    doc,
    [
      { header: 'Check', width: 24 },
      { header: 'Outcome', width: 10 },
      { header: 'What was found', width: 66 },
    ],
    result.checks.map((check) => [{ text: check.id, font: 'mono' }, OUTCOME[check.status], check.message]),
  );
}
