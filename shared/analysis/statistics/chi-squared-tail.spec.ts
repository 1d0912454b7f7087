import fc from 'fast-check';
import { jStat } from 'jstat';
import { log10ChiSquaredUpperTail, log10NormalUpperTail } from './chi-squared-tail';

describe('log10ChiSquaredUpperTail', () => {
  it('agrees with jstat’s chi-squared CDF where 1 − CDF is well represented', () => {
    // Reference: jStat.chisquare.cdf (jstat 1.9), upper tail 1 − F, for tails above 1e-10.
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 60 }), fc.double({ min: 0.01, max: 80, noNaN: true }), (dof, statistic) => {
        const reference = 1 - jStat.chisquare.cdf(statistic, dof);
        fc.pre(reference > 1e-10);
        return Math.abs(10 ** log10ChiSquaredUpperTail(statistic, dof) / reference - 1) < 1e-6;
      }),
    );
  });

  it('gives P(χ²₁ ≥ 100) = erfc(√50) (Python’s math.erfc, computed here: 1.5239706048320995e-23)', () => {
    expect(log10ChiSquaredUpperTail(100, 1)).toBeCloseTo(Math.log10(1.5239706048320995e-23), 10);
  });

  it('stays finite far below the smallest double: P(χ²₂ ≥ x) = e^(−x/2) exactly', () => {
    // With two degrees of freedom the chi-squared tail is the exponential one (a textbook identity).
    expect(log10ChiSquaredUpperTail(20_000, 2)).toBeCloseTo(-10_000 / Math.LN10, 8);
  });

  it('is 0 (p = 1) for a zero statistic or no degrees of freedom', () => {
    expect(log10ChiSquaredUpperTail(0, 3)).toBe(0);
    expect(log10ChiSquaredUpperTail(5, 0)).toBe(0);
  });
});

describe('log10NormalUpperTail', () => {
  it('gives P(Z ≥ 10) = ½·erfc(10/√2) (Python’s math.erfc, computed here: 7.619853024160593e-24)', () => {
    expect(log10NormalUpperTail(10)).toBeCloseTo(Math.log10(7.619853024160593e-24), 10);
  });

  it('follows the Mills-ratio expansion far out, z = 40 (Abramowitz and Stegun 26.2.12)', () => {
    const z = 40;
    const mills = -(z * z) / 2 - Math.log(z * Math.sqrt(2 * Math.PI)) + Math.log(1 - 1 / z ** 2 + 3 / z ** 4);
    expect(log10NormalUpperTail(z)).toBeCloseTo(mills / Math.LN10, 6);
  });

  it('is ½ at 0 and above ½ below it', () => {
    expect(10 ** log10NormalUpperTail(0)).toBeCloseTo(0.5, 12);
    expect(10 ** log10NormalUpperTail(-1)).toBeCloseTo(0.8413447460685429, 12); // Φ(1), Python: 1 − ½·erfc(1/√2)
  });
});
