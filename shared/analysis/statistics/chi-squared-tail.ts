import { jStat } from 'jstat';

/** Relative size at which the continued fraction has converged in double precision. */
const CONVERGED = 1e-16;
/** Stand-in for zero in the modified Lentz method (Press et al., Numerical Recipes, §5.2). */
const TINY = 1e-300;

/**
 * log10 of the chi-squared upper tail P(χ²_k ≥ x) = Q(k/2, x/2), the regularised upper incomplete
 * gamma function, without underflow: where Q is not small (x/2 < k/2 + 1) it is 1 − P from jstat's
 * series; otherwise ln Q = −x/2 + (k/2)·ln(x/2) − lnΓ(k/2) + ln(continued fraction), the continued
 * fraction of Q evaluated by the modified Lentz method (Press, Teukolsky, Vetterling, Flannery,
 * Numerical Recipes, 3rd ed. (2007), §6.2, Eq. 6.2.7; Lentz, Appl. Opt. 15, 668 (1976)). A p-value
 * of 10^−5000 is thus still a number, never 0.
 */
export function log10ChiSquaredUpperTail(statistic: number, degreesOfFreedom: number): number {
  if (!(statistic > 0) || degreesOfFreedom <= 0) return 0;
  const a = degreesOfFreedom / 2;
  const x = statistic / 2;
  if (x < a + 1) {
    return Math.log10(Math.max(1 - jStat.lowRegGamma(a, x), Number.MIN_VALUE));
  }
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let fraction = d;
  for (let i = 1; i < 10_000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const step = d * c;
    fraction *= step;
    if (Math.abs(step - 1) < CONVERGED) break;
  }
  return (-x + a * Math.log(x) - jStat.gammaln(a) + Math.log(fraction)) / Math.LN10;
}

/**
 * log10 of the standard normal upper tail P(Z ≥ z): for z > 0 it is ½·P(χ²₁ ≥ z²) (Z² is chi-squared
 * with one degree of freedom), so it shares the log-space evaluation above; for z ≤ 0, 1 − P(Z ≥ −z).
 */
export function log10NormalUpperTail(z: number): number {
  if (Number.isNaN(z)) return 0;
  if (z > 0) return log10ChiSquaredUpperTail(z * z, 1) + Math.log10(0.5);
  return Math.log10(1 - 0.5 * 10 ** log10ChiSquaredUpperTail(z * z, 1));
}
