import type { RunReportDto } from '@shared/api';
import { textColumn, useType } from './pdf-blocks';
import { formatInstant } from './pdf-dates';
import { TONE, TYPE } from './pdf-style';

/**
 * The footer of every page, written once the page count is known (the document buffers its pages):
 * which report and page it is, and when and by whom it was exported.
 */
export function writeFooters(doc: PDFKit.PDFDocument, report: RunReportDto): void {
  const { start, count } = doc.bufferedPageRange();
  for (let index = start; index < start + count; index++) {
    doc.switchToPage(index);
    const { left, width } = textColumn(doc);
    const bottomMargin = doc.page.margins.bottom;
    // Text below the bottom margin would start a new page: lift the margin while writing the footer.
    doc.page.margins.bottom = 0;
    const top = doc.page.height - bottomMargin + 18;
    doc
      .moveTo(left, top - 5)
      .lineTo(left + width, top - 5)
      .lineWidth(0.4)
      .strokeColor(TONE.rule)
      .stroke();
    useType(doc, 'body', TYPE.small, TONE.muted);
    doc.text(`Bellkeep run report · run ${report.run.id} · page ${index - start + 1} of ${count}`, left, top, { width, lineBreak: false });
    doc.text(`Exported ${formatInstant(report.exportedAt)} by ${report.exportedBy}`, left, top, { width, align: 'right', lineBreak: false });
    doc.page.margins.bottom = bottomMargin;
  }
}
