import { log10ChiSquaredUpperTail } from './chi-squared-tail';

/** Outcome of a Pearson chi-squared test. */
export interface ChiSquaredTest {
  /** The statistic Σ (observed − expected)² / expected. */
  statistic: number;
  /** Degrees of freedom. */
  degreesOfFreedom: number;
  /** Upper-tail p-value; 1 when there is nothing to test (may underflow to 0: see log10PValue). */
  pValue: number;
  /** log10 of the p-value, computed in log space (never −Infinity for a finite statistic). */
  log10PValue: number;
}

/**
 * Pearson's chi-squared goodness-of-fit test of `observed` counts against the category
 * `probabilities`: χ² = Σ (O − N·p)²/(N·p), k − 1 degrees of freedom (Pearson, Phil. Mag. 50, 157
 * (1900)); the p-value in log space (`log10ChiSquaredUpperTail`).
 */
export function chiSquaredGoodnessOfFit(observed: readonly number[], probabilities: readonly number[]): ChiSquaredTest {
  const total = observed.reduce((sum, count) => sum + count, 0);
  const degreesOfFreedom = observed.length - 1;
  if (total === 0) {
    return { statistic: 0, degreesOfFreedom, pValue: 1, log10PValue: 0 };
  }
  let statistic = 0;
  observed.forEach((count, i) => {
    const expected = total * probabilities[i];
    statistic += (count - expected) ** 2 / expected;
  });
  return chiSquaredTest(statistic, degreesOfFreedom);
}

/** A chi-squared test's outcome from its statistic and degrees of freedom, the tail in log space. */
export function chiSquaredTest(statistic: number, degreesOfFreedom: number): ChiSquaredTest {
  const log10PValue = log10ChiSquaredUpperTail(statistic, degreesOfFreedom);
  return { statistic, degreesOfFreedom, pValue: 10 ** log10PValue, log10PValue };
}
