import { ALPHA_DOUBLE_PRIME_COST } from './key-length-budget';
import { bestAlphaDoublePrime } from './best-alpha-double-prime';

/** The part of the key length that depends on α″ (Nadlinger et al. 2022, Supplementary Proposition 2). */
function alphaDoublePrimeBits(rounds: number, smoothing: number, epsilonEA: number, alphaDoublePrime: number): number {
  return -rounds * (alphaDoublePrime - 1) * ALPHA_DOUBLE_PRIME_COST - (smoothing + alphaDoublePrime * Math.log2(1 / epsilonEA)) / (alphaDoublePrime - 1);
}

describe('bestAlphaDoublePrime', () => {
  it.each([1e4, 1.5e6, 1e9])('beats every α″ on a fine grid at n = %p', (rounds) => {
    const best = bestAlphaDoublePrime(rounds, 75, 1e-10);
    const bestBits = alphaDoublePrimeBits(rounds, 75, 1e-10, best);
    for (let i = 1; i < 4000; i++) {
      const other = 1 + (i / 4000) * (1 / Math.log2(5));
      expect(alphaDoublePrimeBits(rounds, 75, 1e-10, other)).toBeLessThanOrEqual(bestBits + 1e-9);
    }
  });

  it('stays inside (1, 1 + 1/log2 5) for very few rounds', () => {
    const alpha = bestAlphaDoublePrime(1, 75, 1e-10);
    expect(alpha).toBeGreaterThan(1);
    expect(alpha).toBeLessThan(1 + 1 / Math.log2(5));
  });
});
