import { jStat } from 'jstat';

/** Relative size below which a further term no longer changes a double-precision sum. */
const NEGLIGIBLE_TERM = 1e-17;

/**
 * log10 of the binomial upper tail P(X ≥ k) for X ~ Bin(n, p), exact and safe from underflow.
 *
 * The tail is summed in log space: the largest term, log P(X = start), comes from jstat's log-gamma,
 * and the others follow by the term ratio P(X = j+1)/P(X = j) = (n−j)/(j+1) · p/(1−p), summed
 * outward from the mode side until they no longer count (the usual stable recurrence for binomial
 * sums, e.g. Loader, "Fast and accurate computation of binomial probabilities" (2000)). When k lies
 * above the mean the upper tail is summed directly; otherwise the lower tail P(X ≤ k−1) is summed and
 * subtracted from 1, so every sum runs over decreasing terms.
 */
export function log10BinomialUpperTail(k: number, n: number, p: number): number {
  if (k <= 0) {
    return 0;
  }
  if (k > n) {
    return -Infinity;
  }
  if (k > n * p) {
    return (logPmf(k, n, p) + Math.log(upperSumRelative(k, n, p))) / Math.LN10;
  }
  const lower = Math.exp(logPmf(k - 1, n, p)) * lowerSumRelative(k - 1, n, p);
  return Math.log1p(-Math.min(lower, 1)) / Math.LN10;
}

/** Natural log of the binomial probability mass P(X = j), through jstat's log-gamma. */
function logPmf(j: number, n: number, p: number): number {
  const logChoose = jStat.gammaln(n + 1) - jStat.gammaln(j + 1) - jStat.gammaln(n - j + 1);
  return logChoose + j * Math.log(p) + (n - j) * Math.log1p(-p);
}

/** Σ_{j ≥ start} P(X = j) / P(X = start), for start above the mean (decreasing terms). */
function upperSumRelative(start: number, n: number, p: number): number {
  const odds = p / (1 - p);
  let term = 1;
  let sum = 1;
  for (let j = start; j < n; j++) {
    term *= ((n - j) / (j + 1)) * odds;
    sum += term;
    if (term < sum * NEGLIGIBLE_TERM) {
      break;
    }
  }
  return sum;
}

/** Σ_{j ≤ start} P(X = j) / P(X = start), for start below the mean (decreasing terms downward). */
function lowerSumRelative(start: number, n: number, p: number): number {
  const inverseOdds = (1 - p) / p;
  let term = 1;
  let sum = 1;
  for (let j = start; j > 0; j--) {
    term *= (j / (n - j + 1)) * inverseOdds;
    sum += term;
    if (term < sum * NEGLIGIBLE_TERM) {
      break;
    }
  }
  return sum;
}
