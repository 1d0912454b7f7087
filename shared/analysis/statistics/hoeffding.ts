/**
 * One-sided Hoeffding deviation for the mean of `trials` independent trials bounded in [0, 1]:
 * δ = sqrt(ln(1/ε) / (2·trials)), so the true mean exceeds the observed one by more than δ (or falls
 * short by more than δ) with probability at most ε (Hoeffding, J. Am. Stat. Assoc. 58, 13 (1963)).
 *
 * @returns Infinity when there are no trials (nothing is known).
 */
export function hoeffdingDeviation(trials: number, epsilon: number): number {
  if (trials <= 0) {
    return Infinity;
  }
  return Math.sqrt(Math.log(1 / epsilon) / (2 * trials));
}
