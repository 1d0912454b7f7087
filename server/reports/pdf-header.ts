import type { RunReportDto } from '@shared/api';
import { bookingWords } from '@shared/format/booking-words';
import { fields, textColumn, useType } from './pdf-blocks';
import { formatInstant } from './pdf-dates';
import { TONE, TYPE } from './pdf-style';

/** The report's title beside Bellkeep's mark, then which run this is and where it came from. */
export function writeHeader(doc: PDFKit.PDFDocument, report: RunReportDto): void {
  const { left, width } = textColumn(doc);
  const { run } = report;
  const booking = bookingWords({ id: run.id, booking: run.booking ?? null, replayOf: run.replayOf ?? null });
  const top = doc.y;
  drawMark(doc, left, top + 3);
  useType(doc, 'bold', TYPE.title, TONE.text).text('Bellkeep run report', left + 34, top, { width: width - 34, lineBreak: false });
  useType(doc, 'bold', TYPE.title, TONE.primary).text(`Run ${run.id}`, left, top, { width, align: 'right', lineBreak: false });
  doc.y = top + TYPE.title + 12;
  fields(doc, [
    { label: 'Setup', value: run.setupName },
    { label: 'Stations', value: `A: ${run.stationA} · B: ${run.stationB}` },
    { label: 'Acquired', value: run.acquiredOn ?? 'not recorded' },
    { label: 'Uploaded by', value: `${run.uploadedBy}, ${formatInstant(run.createdAt)}` },
    report.stations ? { label: 'Station logs', value: `A: ${run.originalName} · B: ${report.stations.stationB.originalName}` } : { label: 'File name', value: run.originalName },
    { label: booking.state, value: [booking.headline, ...booking.details].join(' ') },
    ...(run.notes.trim() === '' ? [] : [{ label: 'Notes', value: run.notes.trim() }]),
  ]);
}

/** Bellkeep's mark: two small filled circles, the stations, joined by one arc. */
function drawMark(doc: PDFKit.PDFDocument, x: number, y: number): void {
  const station = 3.2;
  const span = 24;
  const baseline = y + 13;
  doc.save().lineWidth(1.6).strokeColor(TONE.primary).lineCap('round');
  doc
    .moveTo(x + station, baseline)
    .bezierCurveTo(x + station + 4, baseline - 15, x + span - station - 4, baseline - 15, x + span - station, baseline)
    .stroke();
  doc.circle(x + station, baseline, station).fill(TONE.primary);
  doc.circle(x + span - station, baseline, station).fill(TONE.primary);
  doc.restore();
}
