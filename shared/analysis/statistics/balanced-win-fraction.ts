/** Wins among the test rounds of one CHSH setting pair. */
export interface PairTally {
  rounds: number;
  wins: number;
}

/**
 * The CHSH win fraction with the four setting pairs at the design's equal weights,
 * ω̂ = ¼·Σ_xy w_xy/m_xy: the estimator of ¼·Σ_xy P(win | x, y), the quantity the CHSH inequality
 * bounds (Clauser, Horne, Shimony, Holt, PRL 23, 880 (1969); S = 8ω̂ − 4 from the four
 * correlators). Unlike the pooled fraction Σw/Σm it gains nothing from a test set that holds the
 * pair a local strategy loses less often than the others. Null when a pair has no rounds.
 */
export function balancedWinFraction(pairs: readonly PairTally[]): number | null {
  if (pairs.some((pair) => pair.rounds <= 0)) return null;
  return pairs.reduce((sum, pair) => sum + pair.wins / pair.rounds, 0) / pairs.length;
}

/**
 * One-sided Hoeffding deviation of the balanced estimator, given the pair counts:
 * δ = sqrt(ln(1/ε) · Σ_xy (1/m_xy) / 32). Round i of pair xy contributes a summand in
 * [0, 1/(4·m_xy)], so Σ c_i² = Σ_xy m_xy/(16·m_xy²) and Hoeffding's bound for independent bounded
 * summands of different ranges, P(mean − E ≤ −t) ≤ exp(−2t²/Σ c_i²) (Hoeffding, J. Am. Stat. Assoc.
 * 58, 13 (1963), Theorem 2), gives δ. With equal pair counts m/4 it is the pooled sqrt(ln(1/ε)/(2m)).
 * Infinity when a pair has no rounds.
 */
export function balancedHoeffdingDeviation(pairRounds: readonly number[], epsilon: number): number {
  if (pairRounds.some((rounds) => rounds <= 0)) return Infinity;
  return Math.sqrt((Math.log(1 / epsilon) * sumOfInverses(pairRounds)) / 32);
}

/**
 * log10 of the Hoeffding tail of the balanced estimator at the local bound ¾:
 * P(ω̂ ≥ ¾ + t) ≤ exp(−32t²/Σ_xy(1/m_xy)) (the bound above, solved for the tail), 0 when ω̂ ≤ ¾.
 */
export function log10BalancedLocalTail(winFraction: number, pairRounds: readonly number[]): number {
  const excess = winFraction - 0.75;
  if (excess <= 0 || pairRounds.some((rounds) => rounds <= 0)) return 0;
  return (-32 * excess * excess) / sumOfInverses(pairRounds) / Math.LN10;
}

function sumOfInverses(values: readonly number[]): number {
  return values.reduce((sum, value) => sum + 1 / value, 0);
}

/**
 * The balanced win fraction with `missing` lost rounds added where they lower it most: a missing
 * round's settings are unknown (a source that drops rounds chooses which), so the worst placement
 * is taken. Minimises ¼·Σ w_p/(m_p + k_p) over real k_p ≥ 0 with Σ k_p = missing, a separable convex
 * problem whose optimum has m_p + k_p = max(m_p, sqrt(w_p/λ)) (Karush–Kuhn–Tucker conditions,
 * "water-filling"; Boyd and Vandenberghe, Convex Optimization (2004), §5.5.3); λ by bisection. The
 * real relaxation is at most the best whole-number placement, so the result errs low, never high.
 */
export function balancedWinFractionWithLosses(pairs: readonly PairTally[], missing: number): number | null {
  const plain = balancedWinFraction(pairs);
  if (plain === null || missing <= 0) return plain;
  const added = (lambda: number) => pairs.reduce((sum, pair) => sum + Math.max(0, Math.sqrt(pair.wins / lambda) - pair.rounds), 0);
  let high = Math.max(...pairs.map((pair) => pair.wins / pair.rounds ** 2));
  if (high === 0) return 0;
  let low = high;
  while (added(low) < missing) low /= 4;
  for (let i = 0; i < 200 && high - low > high * 1e-15; i++) {
    const middle = (low + high) / 2;
    if (added(middle) >= missing) low = middle;
    else high = middle;
  }
  // At `low` at least `missing` rounds are placed: never fewer losses than the log lacks.
  const total = pairs.reduce((sum, pair) => sum + pair.wins / Math.max(pair.rounds, Math.sqrt(pair.wins / low)), 0);
  return total / pairs.length;
}
