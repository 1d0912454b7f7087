import { jStat } from 'jstat';

/** Outcome of a Pearson chi-squared test. */
export interface ChiSquaredTest {
  /** The statistic Σ (observed − expected)² / expected. */
  statistic: number;
  /** Degrees of freedom. */
  degreesOfFreedom: number;
  /** Upper-tail p-value from jstat's chi-squared CDF; 1 when there is nothing to test. */
  pValue: number;
}

/**
 * Pearson's chi-squared goodness-of-fit test of `observed` counts against the category
 * `probabilities`: χ² = Σ (O − N·p)²/(N·p), k − 1 degrees of freedom (Pearson, Phil. Mag. 50, 157
 * (1900)); p-value from jstat's chi-squared distribution.
 */
export function chiSquaredGoodnessOfFit(observed: readonly number[], probabilities: readonly number[]): ChiSquaredTest {
  const total = observed.reduce((sum, count) => sum + count, 0);
  const degreesOfFreedom = observed.length - 1;
  if (total === 0) {
    return { statistic: 0, degreesOfFreedom, pValue: 1 };
  }
  let statistic = 0;
  observed.forEach((count, i) => {
    const expected = total * probabilities[i];
    statistic += (count - expected) ** 2 / expected;
  });
  return { statistic, degreesOfFreedom, pValue: upperTail(statistic, degreesOfFreedom) };
}

/** Upper tail 1 − F(χ²; dof) of the chi-squared distribution (jstat). */
export function upperTail(statistic: number, degreesOfFreedom: number): number {
  return Math.max(0, 1 - jStat.chisquare.cdf(statistic, degreesOfFreedom));
}
