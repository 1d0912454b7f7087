import { balancedHoeffdingDeviation } from '../statistics/balanced-win-fraction';

/**
 * Two-sided Hoeffding deviation of an observed CHSH value S = E00 + E01 + E10 − E11 whose four
 * correlators are means over m_xy rounds: t = sqrt(2·ln(2/δ)·Σ_xy 1/m_xy), so |Ŝ − S| ≥ t with
 * probability at most δ.
 *
 * Ŝ = 8ω̂ − 4 with ω̂ the balanced win fraction (CHSH 1969), whose one-sided Hoeffding deviation the
 * engine already has (`balancedHoeffdingDeviation`: Hoeffding, J. Am. Stat. Assoc. 58, 13 (1963),
 * Theorem 2, for independent summands of ranges 1/(4m_xy)). Both sides at δ/2 each make the
 * two-sided bound at δ, and the factor 8 carries it to S: t = 8·sqrt(ln(2/δ)·Σ(1/m_xy)/32). Assumes
 * the rounds are independent given their settings (i.i.d. devices): a bound for a diagnosis.
 *
 * @returns Infinity when a setting pair has no rounds (S is then unknown).
 * @example chshValueDeviation([250, 250, 250, 250], 1e-6 / 33) → 0.759056
 */
export function chshValueDeviation(settingPairRounds: readonly number[], delta: number): number {
  return 8 * balancedHoeffdingDeviation(settingPairRounds, delta / 2);
}
