import type { AnalysisResult, Verdict } from '@shared/analysis';
import type { WithdrawalDto } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { formatInstant } from './pdf-dates';
import { verdictSentence } from '@shared/format/verdict-sentence';
import { bullets, ensureSpace, paragraph, textColumn, useType } from './pdf-blocks';
import { TONE, TYPE } from './pdf-style';

/** The tone of each verdict's word (the sentence under it is the app's and the mail's: `verdictSentence`). */
const VERDICT_TONE: Record<Verdict, string> = {
  ACCEPT: TONE.accept,
  ABORT: TONE.abort,
  INVALID: TONE.invalid,
};

/** How many problems of an unreadable log the report lists. */
const LISTED_PROBLEMS = 10;

/** Diameter of the verdict's symbol. */
const SYMBOL = 30;

/** The verdict as a large word beside its drawn symbol, the sentence that says what it means, and why. */
export function writeVerdict(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  const { left, width } = textColumn(doc);
  const tone = VERDICT_TONE[result.verdict];
  ensureSpace(doc, SYMBOL + 40);
  const top = doc.y + 6;
  doc.rect(left, top, 3, SYMBOL).fill(tone);
  drawSymbol(doc, result.verdict, left + 12, top, tone);
  const textLeft = left + 12 + SYMBOL + 10;
  useType(doc, 'bold', TYPE.verdict, tone).text(result.verdict, textLeft, top - 1, { width: width - textLeft + left, lineBreak: false });
  useType(doc, 'body', TYPE.body).text(verdictSentence(result), textLeft, top + TYPE.verdict + 1, { width: width - textLeft + left });
  doc.y = Math.max(doc.y, top + SYMBOL) + 6;
  if (result.reasons.length > 0) {
    useType(doc, 'bold', TYPE.body).text('Why', left, doc.y, { width });
    doc.y += 1;
    bullets(doc, result.reasons);
  }
  if (result.errors.length > 0) {
    useType(doc, 'bold', TYPE.body).text('Problems in the log', left, doc.y + 2, { width });
    doc.y += 1;
    bullets(doc, result.errors.slice(0, LISTED_PROBLEMS).map(problemLine));
    const more = result.errorCount - Math.min(result.errors.length, LISTED_PROBLEMS);
    if (more > 0) paragraph(doc, `… and ${formatCount(more)} more (${formatCount(result.errorCount)} in all).`, { colour: TONE.muted });
  }
}

/** The mark of a withdrawn upload, under its verdict: the verdict stands in the record, but nobody acts on it. */
export function writeWithdrawn(doc: PDFKit.PDFDocument, withdrawal: WithdrawalDto): void {
  const { left, width } = textColumn(doc);
  useType(doc, 'bold', TYPE.body, TONE.abort).text(
    `UPLOAD WITHDRAWN by ${withdrawal.userName} on ${formatInstant(withdrawal.createdAt)}: no key is kept and no sign-off is made on this run.`,
    left,
    doc.y + 4,
    { width },
  );
  doc.y += 4;
}

function problemLine(problem: AnalysisResult['errors'][number]): string {
  const column = problem.column === null ? '' : `, column ${problem.column}`;
  const value = problem.value === null ? '' : `, value “${problem.value}”`;
  return `Line ${problem.line}${column}${value}: ${problem.message}.`;
}

/**
 * The verdict's symbol, so it never rests on colour alone: a ring holding a tick (ACCEPT), a bar
 * across (ABORT) or an exclamation mark (INVALID).
 */
function drawSymbol(doc: PDFKit.PDFDocument, verdict: Verdict, x: number, y: number, tone: string): void {
  const r = SYMBOL / 2;
  const cx = x + r;
  const cy = y + r;
  doc.save().lineWidth(2.4).strokeColor(tone).lineCap('round').lineJoin('round');
  doc.circle(cx, cy, r - 1.5).stroke();
  if (verdict === 'ACCEPT') {
    doc
      .moveTo(cx - r * 0.45, cy + r * 0.02)
      .lineTo(cx - r * 0.1, cy + r * 0.38)
      .lineTo(cx + r * 0.48, cy - r * 0.36)
      .stroke();
  } else if (verdict === 'ABORT') {
    doc
      .moveTo(cx - r * 0.62, cy + r * 0.62)
      .lineTo(cx + r * 0.62, cy - r * 0.62)
      .stroke();
  } else {
    doc
      .moveTo(cx, cy - r * 0.5)
      .lineTo(cx, cy + r * 0.12)
      .stroke();
    doc.circle(cx, cy + r * 0.45, 1.6).fill(tone);
  }
  doc.restore();
}
