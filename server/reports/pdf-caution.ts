import { ensureSpace, textColumn, useType } from './pdf-blocks';
import { TONE, TYPE } from './pdf-style';

/** Indent of the caution's text from its amber rule. */
const INDENT = 8;

/** The height `writeCaution` takes, so a key figure can be kept on one page with its caution. */
export function cautionHeight(doc: PDFKit.PDFDocument, caution: string): number {
  return useType(doc, 'body', TYPE.small).heightOfString(caution, { width: textColumn(doc).width - INDENT }) + 4;
}

/** A key figure's caution, on an amber rule, directly under the figure it qualifies. */
export function writeCaution(doc: PDFKit.PDFDocument, caution: string): void {
  const { left, width } = textColumn(doc);
  const height = cautionHeight(doc, caution) - 4;
  ensureSpace(doc, height + 4);
  const top = doc.y + 1;
  doc.rect(left, top - 1, 2, height + 2).fill(TONE.threshold);
  useType(doc, 'body', TYPE.small, TONE.threshold).text(caution, left + INDENT, top, { width: width - INDENT });
  doc.y += 3;
}
