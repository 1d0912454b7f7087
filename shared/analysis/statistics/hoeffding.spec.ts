import fc from 'fast-check';
import { jStat } from 'jstat';
import { hoeffdingDeviation } from './hoeffding';

describe('hoeffdingDeviation', () => {
  it('follows sqrt(ln(1/ε)/(2m)) on a hand-computed value', () => {
    // Hand computation: m = 10 000, ε = 1e-10: sqrt(23.02585093 / 20 000) = 0.0339307.
    expect(hoeffdingDeviation(10_000, 1e-10)).toBeCloseTo(0.0339307, 6);
  });

  it('knows nothing without trials', () => {
    expect(hoeffdingDeviation(0, 1e-6)).toBe(Infinity);
  });

  it('never bounds the binomial tail below its exact value computed by jstat', () => {
    // Hoeffding 1963: P(X ≥ m(p + t)) ≤ exp(−2mt²); the exact tail comes from jstat's binomial CDF.
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 400 }), fc.double({ min: 0, max: 1, noNaN: true }), (m, fraction) => {
        const wins = Math.ceil(0.75 * m + fraction * 0.25 * m);
        const t = wins / m - 0.75;
        const exactTail = 1 - jStat.binomial.cdf(wins - 1, m, 0.75);
        return Math.exp(-2 * m * t * t) >= exactTail - 1e-12;
      }),
    );
  });
});
