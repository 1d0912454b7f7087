import { minEntropyPerRound } from './min-entropy';

describe('minEntropyPerRound', () => {
  it('certifies one bit at S = 2√2 and nothing at S = 2', () => {
    // Pironio et al. 2010: P_guess = (1 + sqrt(2 − S²/4))/2 is 1/2 at 2√2 and 1 at S = 2.
    expect(minEntropyPerRound(2 * Math.SQRT2)).toBeCloseTo(1, 12);
    expect(minEntropyPerRound(2)).toBeCloseTo(0, 12);
    expect(minEntropyPerRound(1)).toBeCloseTo(0, 12);
  });

  it('matches a hand-computed value at S = 2.5', () => {
    // Hand computation: 2 − 6.25/4 = 0.4375, sqrt = 0.6614378, 1 − log2(1.6614378) = 0.2675677 (Python math.log2).
    expect(minEntropyPerRound(2.5)).toBeCloseTo(0.2675677, 6);
  });
});
