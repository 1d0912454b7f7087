import type { AnalysisResult } from '@shared/analysis';
import { writeAbsentPart } from './pdf-absent-part';
import { fields } from './pdf-blocks';
import { missingRoundsWords } from './missing-rounds-words';
import { TONE } from './pdf-style';

/**
 * The round indices the log lacks between its first and last: the state as a word (bold amber past
 * the profile's tolerance), then the figures, each missing test round counted as a lost game.
 */
export function writeMissingRounds(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  // Results stored before engine 2.0 have no `missingRounds`.
  const summary = result.missingRounds ?? null;
  if (summary === null) {
    writeAbsentPart(doc, result, 'missing-rounds count');
    return;
  }
  const words = missingRoundsWords(summary);
  fields(doc, [{ label: words.state, value: words.sentence, ...(words.overTolerance ? { labelTone: TONE.threshold } : {}) }]);
}
