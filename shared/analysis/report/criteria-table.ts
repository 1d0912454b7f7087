import { formatCount, formatFixed, formatPercent } from '../../format/numbers';
import type { AnalysisResult } from '../result';
import { LOCAL_WIN_FRACTION, QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { chshCriterion, qberCriterion } from './verdict';
import { generalAcceptanceOf } from './win-threshold';

/** One acceptance rule of a run: observed value, its confidence bound, the threshold and the outcome. */
export interface Criterion {
  /** What is tested. */
  readonly name: string;
  readonly observed: string;
  /** The confidence-corrected value, or an en dash where none applies. */
  readonly bound: string;
  /** The threshold with its comparison, e.g. `≥ 0.8236`. */
  readonly threshold: string;
  /** Where the threshold comes from, e.g. `ω_Q − 0.03`. */
  readonly source: string;
  /** Which of observed and bound the verdict compares with the threshold. */
  readonly judgedOn: 'observed' | 'bound';
  readonly passes: boolean;
}

/**
 * The acceptance rules of an analysed run as the engine's verdict applies them (report/verdict.ts),
 * for the run page and the PDF alike: the CHSH criterion (the balanced win fraction, observed or
 * certified, or the general model's acceptance count), a significant violation and the quantum
 * bound on the win fraction's lower bound, the key-setting error rate, and a positive key when the
 * profile asks for one. (The checks are listed apart.)
 */
export function criteriaTable(result: AnalysisResult, digits: { win: number; percent: number } = { win: 4, percent: 2 }): Criterion[] {
  const { chsh, qber, key, profile } = result;
  const fraction = (value: number | null) => formatFixed(value, digits.win);
  const percent = (value: number | null) => formatPercent(value, digits.percent);
  if (chsh === null || qber === null || key === null) return [];
  const generalProtocol = generalAcceptanceOf(result);
  const general = profile.securityModel === 'general' ? (key.generalAttack ?? undefined) : undefined;
  const win = chshCriterion(chsh, profile, generalProtocol);
  const rate = qberCriterion(qber, profile);
  const lower = chsh.winFractionLower;
  const criteria: Criterion[] = [
    generalProtocol
      ? {
          name: 'CHSH acceptance count (1 − lost / expected test rounds)',
          observed: fraction(win.value),
          bound: '–',
          threshold: `≥ ${fraction(win.threshold)}`,
          source: 'ω_thr, general attacks',
          judgedOn: 'observed',
          passes: win.passes,
        }
      : {
          name: 'CHSH win fraction (setting pairs weighed equally)',
          observed: fraction(chsh.winFraction),
          bound: `≥ ${fraction(lower)}`,
          threshold: `≥ ${fraction(win.threshold)}`,
          source: `ω_Q − ${profile.chshTolerance}`,
          judgedOn: profile.criterion === 'certified' ? 'bound' : 'observed',
          passes: win.passes,
        },
    {
      name: 'Bell violation (lower bound above the local bound)',
      observed: fraction(chsh.winFraction),
      bound: `≥ ${fraction(lower)}`,
      threshold: `> ${fraction(LOCAL_WIN_FRACTION)}`,
      source: 'local bound ¾',
      judgedOn: 'bound',
      passes: lower !== null && lower > LOCAL_WIN_FRACTION,
    },
    {
      name: 'Physical bound (lower bound at most the quantum maximum)',
      observed: fraction(chsh.winFraction),
      bound: `≥ ${fraction(lower)}`,
      threshold: `≤ ${fraction(QUANTUM_WIN_FRACTION)}`,
      source: 'ω_Q = (2 + √2)/4',
      judgedOn: 'bound',
      passes: lower !== null && lower <= QUANTUM_WIN_FRACTION,
    },
    {
      name: 'QBER on the key setting',
      observed: percent(qber.rate),
      bound: `≤ ${percent(qber.rateUpper)}`,
      threshold: `≤ ${percent(rate.threshold)}`,
      source: 'profile tolerance',
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
      source: 'profile',
      judgedOn: 'observed',
      passes: general.bits > 0,
    });
  } else if (profile.requirePositiveKey) {
    criteria.push({
      name: 'Finite key length (collective attacks)',
      observed: `${formatCount(key.finiteKeyBits)} bits`,
      bound: '–',
      threshold: '> 0 bits',
      source: 'profile',
      judgedOn: 'observed',
      passes: key.finiteKeyBits > 0,
    });
  }
  return criteria;
}
