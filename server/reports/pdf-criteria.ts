import { type AnalysisResult, criteriaTable } from '@shared/analysis';
import { formatScientific } from '@shared/format/numbers';
import { grid, paragraph, type GridCell } from './pdf-blocks';
import { PERCENT_DECIMALS, TONE, TYPE, WIN_DECIMALS } from './pdf-style';

/**
 * The acceptance rules as the engine's verdict applies them (shared/analysis/report/criteria-table.ts,
 * the same table as the run page): the CHSH criterion, a significant violation, the quantum bound,
 * the error rate, and a positive key when the profile requires one.
 */
export function writeCriteria(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  const rows = criteriaTable(result, { win: WIN_DECIMALS, percent: PERCENT_DECIMALS });
  if (rows.length === 0) {
    paragraph(doc, 'No criterion was judged: the log could not be analysed.', { colour: TONE.muted });
    return;
  }
  grid(
    doc,
    [
      // Widths in points of the A4 column, so that the thresholds with their sources and the headers fit on one line.
      { header: 'Rule', width: 140 },
      { header: 'Observed', width: 54, align: 'right' },
      { header: 'Bound', width: 57, align: 'right' },
      { header: 'Threshold', width: 141, align: 'right' },
      { header: 'Judged on', width: 58 },
      { header: 'Outcome', width: 49 },
    ],
    rows.map((row): GridCell[] => [row.name, row.observed, row.bound, `${row.threshold} (${row.source})`, row.judgedOn, outcome(row.passes)]),
  );
  paragraph(
    doc,
    `Bounds are one-sided Hoeffding bounds, each holding except with probability ε = ${formatScientific(result.profile.epsilon)}; the win fraction weighs the four CHSH setting pairs equally. ` +
      `The profile judges the ${result.profile.criterion === 'certified' ? 'bounds' : 'observed values'} against its thresholds; a significant violation and the quantum bound are judged on the bound under every profile.`,
    { size: TYPE.small, colour: TONE.muted },
  );
}

function outcome(passes: boolean): GridCell {
  return passes ? { text: 'pass', colour: TONE.accept } : { text: 'FAIL', font: 'bold', colour: TONE.abort };
}
