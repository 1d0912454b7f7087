import { QUANTUM_WIN_FRACTION } from '../../../shared/analysis/statistics/bell-bounds';
import type { AnalysisResult } from '../../../shared/analysis/result';
import { formatCount, formatFixed, formatPercent } from '../../../shared/format/numbers';

/** One acceptance criterion of a run: observed value, its confidence bound, the threshold and the outcome. */
export interface Criterion {
  /** What is tested. */
  readonly name: string;
  readonly observed: string;
  /** The confidence-corrected value, or an en dash where none applies. */
  readonly bound: string;
  /** The threshold with its comparison, e.g. `≥ 0.8236`. */
  readonly threshold: string;
  /** Which of observed and bound the verdict compares with the threshold. */
  readonly judgedOn: 'observed' | 'bound';
  readonly passes: boolean;
}

/**
 * The acceptance criteria of an analysed run, as the engine's verdict applies them: the CHSH win
 * fraction and the key-setting error rate under the profile's criterion (observed or certified),
 * and a positive finite key when the profile asks for one. (The minimum numbers of test rounds are
 * a check family, listed with the checks.)
 */
export function runCriteria(result: AnalysisResult): Criterion[] {
  const { chsh, qber, key, profile } = result;
  if (chsh === null || qber === null || key === null) return [];
  const certified = profile.criterion === 'certified';
  const judgedOn = certified ? 'bound' : 'observed';
  const winThreshold = QUANTUM_WIN_FRACTION - profile.chshTolerance;
  const win = certified ? chsh.winFractionLower : chsh.winFraction;
  const rate = certified ? qber.rateUpper : qber.rate;
  const criteria: Criterion[] = [
    {
      name: 'CHSH win fraction',
      observed: formatFixed(chsh.winFraction),
      bound: `≥ ${formatFixed(chsh.winFractionLower)}`,
      threshold: `≥ ${formatFixed(winThreshold)}`,
      judgedOn,
      passes: win !== null && win >= winThreshold,
    },
    {
      name: 'QBER on the key setting',
      observed: formatPercent(qber.rate),
      bound: `≤ ${formatPercent(qber.rateUpper)}`,
      threshold: `≤ ${formatPercent(profile.qberTolerance)}`,
      judgedOn,
      passes: rate !== null && rate <= profile.qberTolerance,
    },
  ];
  if (profile.requirePositiveKey) {
    criteria.push({
      name: 'Finite key length',
      observed: `${formatCount(key.finiteKeyBits)} bits`,
      bound: '–',
      threshold: '> 0 bits',
      judgedOn: 'observed',
      passes: key.finiteKeyBits > 0,
    });
  }
  return criteria;
}
