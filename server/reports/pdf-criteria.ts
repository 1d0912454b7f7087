import type { AnalysisResult } from '../../shared/analysis/result';
import { QUANTUM_WIN_FRACTION } from '../../shared/analysis/statistics/bell-bounds';
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
  const certified = profile.criterion === 'certified';
  const judged = certified ? 'bound' : 'observed';
  const winThreshold = QUANTUM_WIN_FRACTION - profile.chshTolerance;
  const win = certified ? chsh.winFractionLower : chsh.winFraction;
  const rate = certified ? qber.rateUpper : qber.rate;
  const fraction = (value: number | null) => formatFixed(value, WIN_DECIMALS);
  const percent = (value: number | null) => formatPercent(value, PERCENT_DECIMALS);
  const rows: GridCell[][] = [
    ['CHSH win fraction', fraction(chsh.winFraction), `≥ ${fraction(chsh.winFractionLower)}`, `≥ ${fraction(winThreshold)} (ω_Q − ${profile.chshTolerance})`, judged, outcome(win !== null && win >= winThreshold)],
    ['QBER on the key setting', percent(qber.rate), `≤ ${percent(qber.rateUpper)}`, `≤ ${formatPercent(profile.qberTolerance)}`, judged, outcome(rate !== null && rate <= profile.qberTolerance)],
  ];
  if (profile.requirePositiveKey) {
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
      `The profile judges the ${certified ? 'bounds' : 'observed values'} against the thresholds.`,
    { size: TYPE.small, colour: TONE.muted },
  );
}

function outcome(passes: boolean): GridCell {
  return passes ? { text: 'pass', colour: TONE.accept } : { text: 'FAIL', font: 'bold', colour: TONE.abort };
}
