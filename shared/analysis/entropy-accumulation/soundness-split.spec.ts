import fc from 'fast-check';
import { smoothingCost } from './smoothing-cost';
import { protocolSoundness } from './soundness';
import { SoundnessSplit, soundnessSplit } from './soundness-split';

/** The bits the split costs in the key length (Nadlinger et al. 2022, Supplementary Proposition 2), without its ε_EA terms. */
function splitCost(split: SoundnessSplit, alphaPrime: number, alphaDoublePrime: number): number {
  return (
    smoothingCost(split.epsilonPrime) / (alphaPrime - 1) +
    smoothingCost(split.epsilonDoublePrime) / (alphaDoublePrime - 1) +
    3 * smoothingCost(split.epsilonS - split.epsilonPrime - 2 * split.epsilonDoublePrime) +
    5 * Math.log2(1 / split.epsilonPA)
  );
}

const alpha = fc.double({ min: 1.00001, max: 1.5, noNaN: true });
const total = fc.double({ min: 1e-15, max: 1e-4, noNaN: true });
const factor = fc.double({ min: 0.5, max: 2, noNaN: true });

describe('soundnessSplit', () => {
  it('keeps the protocol soundness within the total, every share positive', () => {
    fc.assert(
      fc.property(total, alpha, alpha, (soundness, alphaPrime, alphaDoublePrime) => {
        const split = soundnessSplit(soundness, alphaPrime, alphaDoublePrime);
        const rest = split.epsilonS - split.epsilonPrime - 2 * split.epsilonDoublePrime;
        return (
          protocolSoundness(split.epsilonEA, split.epsilonPA, split.epsilonS) <= soundness &&
          split.epsilonPA > 0 &&
          split.epsilonPrime > 0 &&
          split.epsilonDoublePrime > 0 &&
          rest > 0
        );
      }),
    );
  });

  it('costs no more than any other split of the same budget', () => {
    fc.assert(
      fc.property(total, alpha, alpha, factor, factor, factor, (soundness, alphaPrime, alphaDoublePrime, a, b, c) => {
        const best = soundnessSplit(soundness, alphaPrime, alphaDoublePrime);
        const rest = best.epsilonS - best.epsilonPrime - 2 * best.epsilonDoublePrime;
        // Rescale three shares and give ε_PA what is left of the same budget.
        const epsilonPrime = best.epsilonPrime * a;
        const epsilonDoublePrime = best.epsilonDoublePrime * b;
        const epsilonS = epsilonPrime + 2 * epsilonDoublePrime + rest * c;
        const epsilonPA = best.epsilonPA + 2 * (best.epsilonS - epsilonS);
        fc.pre(epsilonPA > 0);
        const other = { ...best, epsilonPrime, epsilonDoublePrime, epsilonS, epsilonPA };
        return splitCost(best, alphaPrime, alphaDoublePrime) <= splitCost(other, alphaPrime, alphaDoublePrime) + 1e-9;
      }),
    );
  });
});
