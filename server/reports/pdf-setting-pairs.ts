import type { AnalysisResult, ChshSummary } from '@shared/analysis';
import { formatCount, formatFixed, formatScientific } from '@shared/format/numbers';
import { writeAbsentPart } from './pdf-absent-part';
import { grid, paragraph, type GridCell } from './pdf-blocks';
import { TONE, TYPE, WIN_DECIMALS } from './pdf-style';

/**
 * The four CHSH setting pairs (x, y ∈ {0, 1}): rounds, test rounds, wins, win fraction and its own
 * Hoeffding lower bound; then the balanced win fraction the verdict judges, with the pooled one
 * for reference.
 */
export function writeSettingPairs(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  const { chsh, profile } = result;
  // Results stored before engine 2.0 have no `pairs`.
  const pairs = chsh?.pairs ?? [];
  if (chsh === null || pairs.length === 0) {
    writeAbsentPart(doc, result, 'figures per setting pair');
    return;
  }
  grid(
    doc,
    [
      { header: 'x', width: 5, align: 'right' },
      { header: 'y', width: 5, align: 'right' },
      { header: 'Rounds', width: 14, align: 'right' },
      { header: 'Test rounds', width: 14, align: 'right' },
      { header: 'Wins', width: 14, align: 'right' },
      { header: 'Win fraction', width: 16, align: 'right' },
      { header: 'Lower bound', width: 16, align: 'right' },
    ],
    pairs.map((pair): GridCell[] => [
      String(pair.x),
      String(pair.y),
      formatCount(pair.rounds),
      formatCount(pair.testRounds),
      formatCount(pair.wins),
      fraction(pair.winFraction),
      pair.winFractionLower === null ? '–' : `≥ ${fraction(pair.winFractionLower)}`,
    ]),
  );
  paragraph(doc, balancedSentence(chsh, profile.epsilon));
  paragraph(
    doc,
    'A pair wins a test round when a ⊕ b = x·y. Each lower bound is one-sided Hoeffding at ε over that pair’s test rounds alone; rounds count the pair’s test and generation rounds.',
    { size: TYPE.small, colour: TONE.muted },
  );
}

/** The balanced win fraction judged, the pooled one beside it, and the missing test rounds counted as lost. */
function balancedSentence(chsh: ChshSummary, epsilon: number): string {
  const missing = chsh.missingTestRounds ?? 0;
  const lost =
    missing === 0
      ? ''
      : ` It counts ${formatCount(missing)} missing ${missing === 1 ? 'round' : 'rounds'} drawn for testing as lost, where ${missing === 1 ? 'it lowers' : 'they lower'} it most.`;
  return (
    `The win fraction judged weighs the four pairs equally: ${fraction(chsh.winFraction)}, lower bound ${fraction(chsh.winFractionLower)} at ε = ${formatScientific(epsilon)}.${lost} ` +
    `Pooled over all ${formatCount(chsh.rounds)} test rounds it is ${fraction(chsh.pooledWinFraction)} (${formatCount(chsh.wins)} won), for reference only: ` +
    'unequal setting shares can raise a pooled figure, so nothing is judged on it.'
  );
}

/** A win fraction to the digits of the verdict's reasons, or an en dash. */
function fraction(value: number | null): string {
  return formatFixed(value, WIN_DECIMALS);
}
