import fc from 'fast-check';
import { keyLengthBudget } from './key-length-budget';
import { optimiseKeyLength } from './optimise-key-length';

const SETTING = { rounds: 1_500_000, testProbability: 13 / 256, omegaThreshold: 0.825538, syndromeBits: 296_517 };

describe('optimiseKeyLength', () => {
  const best = optimiseKeyLength(SETTING, 1e-10);

  it('reports the budget its parameters give', () => {
    expect(keyLengthBudget(SETTING, best.parameters)).toBe(best.budget);
  });

  it('cannot be improved by moving t, α′, α″ or the split of ε_s', () => {
    const nudge = fc.double({ min: -1, max: 1, noNaN: true });
    fc.assert(
      fc.property(fc.constantFrom(1e-3, 1e-2, 0.3), nudge, nudge, nudge, nudge, nudge, (scale, dt, da, dda, de, dde) => {
        const p = best.parameters;
        const epsilonPrime = p.epsilonPrime * Math.exp(de * scale);
        const epsilonDoublePrime = p.epsilonDoublePrime * Math.exp(dde * scale);
        // The same ε_s and ε_PA, so the soundness is unchanged; ε′ and ε″ move within ε_s.
        fc.pre(epsilonPrime + 2 * epsilonDoublePrime < p.epsilonS);
        const moved = {
          ...p,
          t: p.t + dt * scale * 1e-2,
          alphaPrime: 1 + (p.alphaPrime - 1) * Math.exp(da * scale),
          alphaDoublePrime: 1 + (p.alphaDoublePrime - 1) * Math.exp(dda * scale),
          epsilonPrime,
          epsilonDoublePrime,
        };
        return keyLengthBudget(SETTING, moved) <= best.budget + 1e-3;
      }),
      { numRuns: 300 },
    );
  });

  it('keeps α′ in (1, 2), α″ in (1, 1 + 1/log2 5) and t in [¾, ω_max)', () => {
    const { t, alphaPrime, alphaDoublePrime } = best.parameters;
    expect(alphaPrime).toBeGreaterThan(1);
    expect(alphaPrime).toBeLessThan(2);
    expect(alphaDoublePrime).toBeGreaterThan(1);
    expect(alphaDoublePrime).toBeLessThan(1 + 1 / Math.log2(5));
    expect(t).toBeGreaterThanOrEqual(0.75);
    expect(t).toBeLessThan((2 + Math.SQRT2) / 4);
  });
});
