import type { PdfFont } from './pdf-fonts';
import { TONE, TYPE } from './pdf-style';

// The building blocks every section is written with. Each starts at doc.y on the left margin,
// moves doc.y below itself, and begins a new page first when it would not fit.

/** Width of the label column of `fields`. */
const LABEL_WIDTH = 132;

/** Space between a label and its value. */
const LABEL_GAP = 8;

/** The text column: its left edge and width. */
export function textColumn(doc: PDFKit.PDFDocument): { left: number; width: number } {
  const { margins, width } = doc.page;
  return { left: margins.left, width: width - margins.left - margins.right };
}

/** Starts a new page unless `height` points still fit above the bottom margin. */
export function ensureSpace(doc: PDFKit.PDFDocument, height: number): void {
  if (doc.y + height > doc.page.maxY()) {
    doc.addPage();
  }
}

/** Sets face, size and colour in one call. */
export function useType(doc: PDFKit.PDFDocument, font: PdfFont, size: number, colour: string = TONE.text): PDFKit.PDFDocument {
  return doc.font(font).fontSize(size).fillColor(colour);
}

/** A section title with a rule under it, kept on a page with at least `keepWith` points of what follows. */
export function heading(doc: PDFKit.PDFDocument, title: string, keepWith = 48): void {
  const { left, width } = textColumn(doc);
  doc.y += 10;
  ensureSpace(doc, 20 + keepWith);
  useType(doc, 'bold', TYPE.heading, TONE.primary).text(title, left, doc.y, { width });
  const rule = doc.y + 1;
  doc
    .moveTo(left, rule)
    .lineTo(left + width, rule)
    .lineWidth(0.6)
    .strokeColor(TONE.primary)
    .stroke();
  doc.y = rule + 5;
}

/** A title within a section, kept on a page with at least `keepWith` points of what follows. */
export function subheading(doc: PDFKit.PDFDocument, title: string, keepWith = 40): void {
  const { left, width } = textColumn(doc);
  doc.y += 5;
  ensureSpace(doc, TYPE.body + 4 + keepWith);
  useType(doc, 'bold', TYPE.body, TONE.primary).text(title, left, doc.y, { width });
  doc.y += 2;
}

/** Running text across the column. */
export function paragraph(doc: PDFKit.PDFDocument, text: string, options: { font?: PdfFont; size?: number; colour?: string } = {}): void {
  const { left, width } = textColumn(doc);
  useType(doc, options.font ?? 'body', options.size ?? TYPE.body, options.colour);
  ensureSpace(doc, doc.heightOfString(text, { width }));
  doc.text(text, left, doc.y, { width });
  doc.y += 2;
}

/** A list, each item after a drawn bullet. */
export function bullets(doc: PDFKit.PDFDocument, items: readonly string[], colour: string = TONE.text): void {
  const { left, width } = textColumn(doc);
  const indent = 10;
  for (const item of items) {
    useType(doc, 'body', TYPE.body, colour);
    ensureSpace(doc, doc.heightOfString(item, { width: width - indent }));
    const top = doc.y;
    doc.circle(left + 3, top + TYPE.body * 0.55, 1.3).fill(colour);
    doc.text(item, left + indent, top, { width: width - indent });
    doc.y += 1.5;
  }
}

/** One line of a `fields` list; `mono` for hex digits, keys and other strings read digit by digit. */
export interface Field {
  label: string;
  value: string;
  mono?: boolean;
  /** A tone that flags the row: the label is set bold in it (its words must still say why). */
  labelTone?: string;
}

/** Space below each row of `fields`. */
const FIELD_GAP = 2.5;

/** Labels on the left, values beside them, one row each; long values wrap in their column. */
export function fields(doc: PDFKit.PDFDocument, rows: readonly Field[]): void {
  const { left } = textColumn(doc);
  const { valueLeft, valueWidth } = fieldColumns(doc);
  for (const row of rows) {
    const height = fieldHeight(doc, row);
    ensureSpace(doc, height);
    const top = doc.y;
    useLabelType(doc, row).text(row.label, left, top, { width: LABEL_WIDTH });
    useValueType(doc, row).text(row.value, valueLeft, top + (row.mono ? 0.8 : 0), { width: valueWidth });
    doc.y = top + height + FIELD_GAP;
  }
}

/** The height `fields` takes for these rows, so a caller can keep them on one page with what follows. */
export function fieldsHeight(doc: PDFKit.PDFDocument, rows: readonly Field[]): number {
  return rows.reduce((total, row) => total + fieldHeight(doc, row) + FIELD_GAP, 0);
}

function fieldColumns(doc: PDFKit.PDFDocument): { valueLeft: number; valueWidth: number } {
  const { left, width } = textColumn(doc);
  return { valueLeft: left + LABEL_WIDTH + LABEL_GAP, valueWidth: width - LABEL_WIDTH - LABEL_GAP };
}

function fieldHeight(doc: PDFKit.PDFDocument, row: Field): number {
  const labelHeight = useLabelType(doc, row).heightOfString(row.label, { width: LABEL_WIDTH });
  return Math.max(labelHeight, useValueType(doc, row).heightOfString(row.value, { width: fieldColumns(doc).valueWidth }));
}

function useLabelType(doc: PDFKit.PDFDocument, row: Field): PDFKit.PDFDocument {
  return row.labelTone ? useType(doc, 'bold', TYPE.body, row.labelTone) : useType(doc, 'body', TYPE.body, TONE.muted);
}

function useValueType(doc: PDFKit.PDFDocument, row: Field): PDFKit.PDFDocument {
  return row.mono ? useType(doc, 'mono', TYPE.mono) : useType(doc, 'body', TYPE.body);
}

/** Monospaced text across the whole column on a light ground (a PEM, a base64 signature). */
export function monoBlock(doc: PDFKit.PDFDocument, text: string): void {
  const { left, width } = textColumn(doc);
  const padding = 4;
  useType(doc, 'mono', TYPE.mono);
  const height = doc.heightOfString(text, { width: width - 2 * padding }) + 2 * padding;
  ensureSpace(doc, height);
  const top = doc.y;
  doc.rect(left, top, width, height).fill(TONE.fill);
  useType(doc, 'mono', TYPE.mono).text(text, left + padding, top + padding, { width: width - 2 * padding });
  doc.y = top + height + 3;
}

/** A column of a `grid`: its header, its share of the width, how its cells align. */
export interface GridColumn {
  header: string;
  width: number;
  align?: 'left' | 'right';
}

/** A cell of a `grid`: text, or text in a face and colour of its own. */
export type GridCell = string | { text: string; font?: PdfFont; colour?: string };

/** Space around the text of a `grid` cell. */
const CELL_PADDING = 3;

/** A table with a header row and hairlines between rows; rows that do not fit go on to the next page. */
export function grid(doc: PDFKit.PDFDocument, columns: readonly GridColumn[], rows: readonly (readonly GridCell[])[]): void {
  const { left, width } = textColumn(doc);
  const widths = columnWidths(doc, columns);
  const line = (cells: readonly GridCell[], header: boolean) => {
    const parts = cellParts(cells, header);
    const height = rowHeight(doc, widths, cells, header);
    ensureSpace(doc, height);
    const top = doc.y;
    if (header) doc.rect(left, top, width, height).fill(TONE.fill);
    let x = left;
    parts.forEach((part, index) => {
      const colour = header ? TONE.muted : (part.colour ?? TONE.text);
      useType(doc, part.font, sizeOf(part.font), colour).text(part.text, x + CELL_PADDING, top + CELL_PADDING, {
        width: widths[index] - 2 * CELL_PADDING,
        align: columns[index].align ?? 'left',
      });
      x += widths[index];
    });
    doc
      .moveTo(left, top + height)
      .lineTo(left + width, top + height)
      .lineWidth(0.4)
      .strokeColor(TONE.rule)
      .stroke();
    doc.y = top + height;
  };
  line(
    columns.map((column) => column.header),
    true,
  );
  for (const row of rows) line(row, false);
  doc.y += 4;
}

/** The height `grid` takes for these rows, so a caller can keep a table on one page with what goes with it. */
export function gridHeight(doc: PDFKit.PDFDocument, columns: readonly GridColumn[], rows: readonly (readonly GridCell[])[]): number {
  const widths = columnWidths(doc, columns);
  const header = columns.map((column) => column.header);
  return rows.reduce((total, row) => total + rowHeight(doc, widths, row, false), rowHeight(doc, widths, header, true)) + 4;
}

function columnWidths(doc: PDFKit.PDFDocument, columns: readonly GridColumn[]): number[] {
  const { width } = textColumn(doc);
  const total = columns.reduce((sum, column) => sum + column.width, 0);
  return columns.map((column) => (column.width / total) * width);
}

function cellParts(cells: readonly GridCell[], header: boolean): { text: string; font: PdfFont; colour?: string }[] {
  return cells.map((cell) => {
    const part = typeof cell === 'string' ? { text: cell } : cell;
    return { ...part, font: header ? 'bold' : (part.font ?? 'body') };
  });
}

function sizeOf(font: PdfFont): number {
  return font === 'mono' ? TYPE.mono : TYPE.body;
}

function rowHeight(doc: PDFKit.PDFDocument, widths: readonly number[], cells: readonly GridCell[], header: boolean): number {
  const heights = cellParts(cells, header).map((part, index) => useType(doc, part.font, sizeOf(part.font)).heightOfString(part.text, { width: widths[index] - 2 * CELL_PADDING }));
  return Math.max(...heights) + 2 * CELL_PADDING;
}
