import { chshCriterion, qberCriterion } from '../../../shared/analysis/report/verdict';
import { generalThresholdOf } from '../../../shared/analysis/report/win-threshold';
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
  // Judged by the engine's own criteria; a general-attack profile fixes its own threshold ω_thr.
  const general = profile.securityModel === 'general' ? (key.generalAttack ?? undefined) : undefined;
  const win = chshCriterion(chsh, profile, generalThresholdOf(result));
  const rate = qberCriterion(qber, profile);
  const judgedOn = profile.criterion === 'certified' && !general ? 'bound' : 'observed';
  const criteria: Criterion[] = [
    {
      name: 'CHSH win fraction',
      observed: formatFixed(chsh.winFraction),
      bound: `≥ ${formatFixed(chsh.winFractionLower)}`,
      threshold: `≥ ${formatFixed(win.threshold)}`,
      judgedOn,
      passes: win.passes,
    },
    {
      name: 'QBER on the key setting',
      observed: formatPercent(qber.rate),
      bound: `≤ ${formatPercent(qber.rateUpper)}`,
      threshold: `≤ ${formatPercent(rate.threshold)}`,
      judgedOn: profile.criterion === 'certified' ? 'bound' : 'observed',
      passes: rate.passes,
    },
  ];
  if (profile.requirePositiveKey && general) {
    criteria.push({
      name: 'Key length against general attacks',
      observed: `${formatCount(general.bits)} bits`,
      bound: '–',
      threshold: '> 0 bits',
      judgedOn: 'observed',
      passes: general.bits > 0,
    });
  } else if (profile.requirePositiveKey) {
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
