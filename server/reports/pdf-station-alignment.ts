import { type AlignmentPoint, type AlignmentSummary, signedRounds } from '@shared/analysis';
import { formatCount, formatFixed, formatScientific } from '@shared/format/numbers';
import { fields, fieldsHeight, grid, gridHeight, paragraph, subheading, type Field, type GridCell, type GridColumn } from './pdf-blocks';
import { TONE, TYPE } from './pdf-style';

/** The offsets side by side: 33 offsets in three groups of 11 rows. */
const ROWS_PER_GROUP = 11;

/** One group's columns (widths in shares of the column: "+16 (best other)" on one line). */
const GROUP_COLUMNS: readonly GridColumn[] = [
  { header: 'Offset', width: 36 },
  { header: 'S', width: 15, align: 'right' },
  { header: '|S| lies in', width: 24, align: 'right' },
];

/**
 * The alignment check: its sentence (a shift found is the run's reason for INVALID), then S with
 * the interval of |S| at every offset scanned, the centre and the best other offset marked.
 */
export function writeStationAlignment(doc: PDFKit.PDFDocument, alignment: AlignmentSummary | null): void {
  if (alignment === null) {
    subheading(doc, 'Alignment check');
    paragraph(doc, 'No alignment check: a station log could not be read.', { colour: TONE.muted });
    return;
  }
  const finding: Field = { label: alignment.shifted ? 'Shift found' : 'No shift found', value: alignment.sentence, ...(alignment.shifted ? { labelTone: TONE.abort } : {}) };
  const cells = alignment.series.map((point) => pointCells(point, alignment));
  const groups = Math.ceil(cells.length / ROWS_PER_GROUP);
  const columns = Array.from({ length: groups }, () => GROUP_COLUMNS).flat();
  const rows = Array.from({ length: Math.min(ROWS_PER_GROUP, cells.length) }, (_, row) =>
    Array.from({ length: groups }, (_, group) => cells[group * ROWS_PER_GROUP + row] ?? ['', '', '']).flat(),
  );
  // The sentence and the table it rests on stay on one page.
  subheading(doc, 'Alignment check', fieldsHeight(doc, [finding]) + 2 + gridHeight(doc, columns, rows));
  fields(doc, [finding]);
  doc.y += 2;
  grid(doc, columns, rows);
  paragraph(
    doc,
    `S = E00 + E01 + E10 − E11 of station A's first ${formatCount(alignment.roundsRead)} records, each paired with station B's record at offset k ` +
      `(A's round r with B's round r + k). Each |S| lies in its interval for all offsets at once with probability at least 1 − ${formatScientific(alignment.significance)} ` +
      "(Hoeffding's inequality with a union bound over the offsets), assuming rounds independent given their settings; " +
      "another offset fits clearly better than the centre when its interval lies wholly above the centre's.",
    { size: TYPE.small, colour: TONE.muted },
  );
}

/** One offset's cells: the offset (marked when it is the centre or the best other), S and the interval of |S|. */
function pointCells(point: AlignmentPoint, alignment: AlignmentSummary): GridCell[] {
  const mark = point.offset === alignment.centre ? ' (centre)' : point.offset === alignment.bestOffset ? ' (best other)' : '';
  const marked = mark === '' ? {} : { font: 'bold' as const, colour: point.offset === alignment.bestOffset && alignment.shifted ? TONE.abort : TONE.text };
  return [
    { text: `${signedRounds(point.offset)}${mark}`, ...marked },
    { text: shownS(point.chshValue), ...marked },
    { text: `${formatFixed(point.lower, 2)}–${formatFixed(point.upper, 2)}`, ...marked },
  ];
}

/** S with two decimals and a true minus sign, never "−0.00"; an en dash when a setting pair had no rounds. */
function shownS(value: number | null): string {
  const text = formatFixed(value, 2);
  return /^-0\.00$/.test(text) ? '0.00' : text.replace(/^-/, '−');
}
