import fc from 'fast-check';
import { jStat } from 'jstat';
import { log10BinomialUpperTail } from './binomial-tail';

describe('log10BinomialUpperTail', () => {
  it('gives p^n for the top value', () => {
    // Closed form: P(Bin(10, 3/4) ≥ 10) = 0.75^10 = 0.0563135.
    expect(10 ** log10BinomialUpperTail(10, 10, 0.75)).toBeCloseTo(0.75 ** 10, 12);
  });

  it('agrees with the tail from jstat’s binomial CDF on both sides of the mean', () => {
    // Reference: jstat binomial.cdf, P(X ≥ k) = 1 − F(k − 1).
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 300 }), fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom(0.5, 0.75, 0.9), (n, f, p) => {
        const k = Math.max(1, Math.round(f * n));
        const reference = 1 - jStat.binomial.cdf(k - 1, n, p);
        const ours = 10 ** log10BinomialUpperTail(k, n, p);
        return Math.abs(ours - reference) <= 1e-9 + 1e-6 * reference;
      }),
    );
  });

  it('carries tails far below double-precision underflow, between the point mass and the Chernoff bound', () => {
    // For k above the mean: P(X = k) ≤ P(X ≥ k) ≤ exp(−n·D(k/n ‖ p)) (Chernoff 1952), D the
    // Kullback–Leibler divergence; the point mass comes from jstat's log-gamma.
    const n = 10_000_000;
    const k = 8_000_000;
    const p = 0.75;
    const q = k / n;
    const divergence = q * Math.log(q / p) + (1 - q) * Math.log((1 - q) / (1 - p));
    const log10Chernoff = (-n * divergence) / Math.LN10;
    const log10PointMass = (jStat.gammaln(n + 1) - jStat.gammaln(k + 1) - jStat.gammaln(n - k + 1) + k * Math.log(p) + (n - k) * Math.log(1 - p)) / Math.LN10;
    const ours = log10BinomialUpperTail(k, n, p);
    expect(ours).toBeLessThan(-10_000);
    expect(ours).toBeGreaterThanOrEqual(log10PointMass);
    expect(ours).toBeLessThanOrEqual(log10Chernoff);
  });

  it('is certain at or below zero wins and impossible above n', () => {
    expect(log10BinomialUpperTail(0, 50, 0.75)).toBe(0);
    expect(log10BinomialUpperTail(51, 50, 0.75)).toBe(-Infinity);
  });
});
