import type { AnalysisResult } from '@shared/analysis';
import { paragraph } from './pdf-blocks';
import { TONE } from './pdf-style';

/**
 * The muted sentence in place of a part the result lacks: an unreadable log has none to show, and a
 * result stored by an engine before 2.0 never recorded it (stored results are never recomputed).
 */
export function writeAbsentPart(doc: PDFKit.PDFDocument, result: AnalysisResult, part: string): void {
  const sentence =
    result.verdict === 'INVALID'
      ? `No ${part}: the log could not be analysed.`
      : `No ${part}: not recorded by the engine that stored this result (version ${result.engineVersion}).`;
  paragraph(doc, sentence, { colour: TONE.muted });
}
