import fc from 'fast-check';
import { QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { asymptoticRate } from '../statistics/asymptotic-rate';
import { chshValueFromWinFraction } from '../statistics/chsh-value';
import { minEntropyPerRound } from '../statistics/min-entropy';
import { LOWEST_QUANTUM_WIN_FRACTION, rateFunction, rateFunctionSlope } from './rate-function';

const keyBranch = fc.double({ min: 0.75, max: QUANTUM_WIN_FRACTION, noNaN: true });

describe('rateFunction', () => {
  it('certifies one bit at the quantum maximum and nothing from ¼ to ¾', () => {
    expect(rateFunction(QUANTUM_WIN_FRACTION)).toBeCloseTo(1, 12);
    expect(rateFunction(LOWEST_QUANTUM_WIN_FRACTION)).toBeCloseTo(1, 12);
    for (const winProbability of [0.25, 0.4, 0.5, 0.75]) {
      expect(rateFunction(winProbability)).toBe(0);
    }
  });

  it('is the von Neumann curve of Pironio et al. (NJP 11, 045021 (2009)) at S = 8ω − 4', () => {
    // asymptoticRate(S, 0) = 1 − h((1 + sqrt((S/2)² − 1))/2), the same entropy written in S.
    fc.assert(fc.property(keyBranch, (winProbability) => Math.abs(rateFunction(winProbability) - asymptoticRate(chshValueFromWinFraction(winProbability), 0)) < 1e-12));
  });

  it('lies above the min-entropy curve of Pironio et al. (Nature 464, 1021 (2010)), meeting it only at the ends', () => {
    // Von Neumann entropy is never below min-entropy; both are 0 at S = 2 and 1 at S = 2√2.
    fc.assert(fc.property(keyBranch, (winProbability) => rateFunction(winProbability) >= minEntropyPerRound(chshValueFromWinFraction(winProbability)) - 1e-12));
    expect(rateFunction(0.8125) - minEntropyPerRound(2.5)).toBeGreaterThan(0.1);
  });

  it('is symmetric about ½', () => {
    fc.assert(fc.property(keyBranch, (winProbability) => Math.abs(rateFunction(winProbability) - rateFunction(1 - winProbability)) < 1e-12));
  });
});

describe('rateFunctionSlope', () => {
  it('matches a central difference of the rate function', () => {
    for (const winProbability of [0.76, 0.8, 0.8255, 0.84, 0.85]) {
      const step = 1e-6;
      const difference = (rateFunction(winProbability + step) - rateFunction(winProbability - step)) / (2 * step);
      expect(rateFunctionSlope(winProbability)).toBeCloseTo(difference, 5);
    }
  });

  it('is the right-hand slope 4/ln 2 at ¾, 0 inside (¼, ¾) and steep at the quantum maximum', () => {
    // s = 1 at ω_max, where log2((1 + s)/(1 − s)) diverges; in doubles s falls a hair short of 1.
    // Near ¾, η ≈ (16ω² − 16ω + 3)/(2 ln 2), whose slope at ¾ is 4/ln 2.
    expect(rateFunctionSlope(0.75)).toBeCloseTo(4 / Math.LN2, 12);
    expect(rateFunctionSlope(0.6)).toBe(0);
    expect(rateFunctionSlope(QUANTUM_WIN_FRACTION)).toBeGreaterThan(100);
    expect(rateFunctionSlope(0.85)).toBeLessThan(20);
  });
});
