import type { AnalysisResult } from '../../shared/analysis/result';
import { chshCriterion, qberCriterion } from '../../shared/analysis/report/verdict';
import { generalThresholdOf } from '../../shared/analysis/report/win-threshold';
import { formatCount, formatFixed, formatPercent, formatScientific } from '../../shared/format/numbers';
import { grid, paragraph, type GridCell } from './pdf-blocks';
import { PERCENT_DECIMALS, TONE, TYPE, WIN_DECIMALS } from './pdf-style';

/**
 * The acceptance criteria as the engine's verdict applies them (shared/analysis/report/verdict.ts):
 * the win fraction and the error rate, observed or confidence-corrected as the profile's criterion
 * says, and a positive finite key when the profile requires one.
 */
export function writeCriteria(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  const { chsh, qber, key, profile } = result;
  if (chsh === null || qber === null || key === null) {
    paragraph(doc, 'No criterion was judged: the log could not be analysed.', { colour: TONE.muted });
    return;
  }
  // Judged by the engine's own criteria; a general-attack profile fixes its own threshold ω_thr.
  const general = generalThresholdOf(result);
  const win = chshCriterion(chsh, profile, general);
  const rate = qberCriterion(qber, profile);
  const judged = profile.criterion === 'certified' ? 'bound' : 'observed';
  const thresholdSource = general === undefined ? `ω_Q − ${profile.chshTolerance}` : 'ω_thr, general attacks';
  const fraction = (value: number | null) => formatFixed(value, WIN_DECIMALS);
  const percent = (value: number | null) => formatPercent(value, PERCENT_DECIMALS);
  const rows: GridCell[][] = [
    ['CHSH win fraction', fraction(chsh.winFraction), `≥ ${fraction(chsh.winFractionLower)}`, `≥ ${fraction(win.threshold)} (${thresholdSource})`, general === undefined ? judged : 'observed', outcome(win.passes)],
    ['QBER on the key setting', percent(qber.rate), `≤ ${percent(qber.rateUpper)}`, `≤ ${formatPercent(profile.qberTolerance)}`, judged, outcome(rate.passes)],
  ];
  if (profile.requirePositiveKey && general !== undefined) {
    const bits = key.generalAttackBits ?? 0;
    rows.push(['Key against general attacks', `${formatCount(bits)} bits`, '–', '> 0 bits', 'observed', outcome(bits > 0)]);
  } else if (profile.requirePositiveKey) {
    rows.push(['Finite key length', `${formatCount(key.finiteKeyBits)} bits`, '–', '> 0 bits', 'observed', outcome(key.finiteKeyBits > 0)]);
  }
  grid(
    doc,
    [
      { header: 'Criterion', width: 20 },
      { header: 'Observed', width: 11, align: 'right' },
      { header: 'Bound', width: 13, align: 'right' },
      { header: 'Threshold', width: 20, align: 'right' },
      { header: 'Judged on', width: 10 },
      { header: 'Outcome', width: 9 },
    ],
    rows,
  );
  paragraph(
    doc,
    `Bounds are one-sided Hoeffding bounds, each holding except with probability ε = ${formatScientific(profile.epsilon)}. ` +
      `The profile judges the ${judged === 'bound' ? 'bounds' : 'observed values'} against the thresholds.`,
    { size: TYPE.small, colour: TONE.muted },
  );
}

function outcome(passes: boolean): GridCell {
  return passes ? { text: 'pass', colour: TONE.accept } : { text: 'FAIL', font: 'bold', colour: TONE.abort };
}
