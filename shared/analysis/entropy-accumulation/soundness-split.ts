import { HASH_FAILURE } from './soundness';

/** The failure probabilities a total soundness budget is split into. */
export interface SoundnessSplit {
  epsilonEA: number;
  epsilonPA: number;
  epsilonS: number;
  epsilonPrime: number;
  epsilonDoublePrime: number;
}

// A relative margin that keeps rounding from pushing max(ε_EA, ε_PA + 2ε_s) + 4ε_h above the total;
// it costs about 1e-11 bits.
const ROUNDING_MARGIN = 1 - 1e-12;

/**
 * The split of the total soundness ε that gives the longest key for given α′, α″ (Nadlinger et al.,
 * Nature 607, 682 (2022), Supplementary Proposition 2, where soundness = max(ε_EA, ε_PA + 2ε_s) + 4ε_h).
 *
 * Both arguments of the max get the whole budget B = ε − 4ε_h: the key only grows with ε_EA. The
 * rest of the key length depends on the split through w′·ϑ(ε′) + w″·ϑ(ε″) + 3ϑ(ε_s − ε′ − 2ε″)
 * + 5·log(1/ε_PA), w = 1/(α−1), under ε_PA + 2ε′ + 4ε″ + 2(ε_s − ε′ − 2ε″) = B. With
 * ϑ(ε) = 1 − 2·log2 ε + O(ε²), this is −Σ c_i·log z_i under Σ z_i = B for the shares
 * z = (2ε′, 4ε″, 2(ε_s − ε′ − 2ε″), ε_PA) and c = (2w′, 2w″, 6, 5); its Lagrange condition gives
 * z_i = c_i·B/Σc. Exact up to the O(ε²) term of ϑ, far below a bit for any ε < 10^−3.
 */
export function soundnessSplit(totalSoundness: number, alphaPrime: number, alphaDoublePrime: number): SoundnessSplit {
  const budget = (totalSoundness - 4 * HASH_FAILURE) * ROUNDING_MARGIN;
  const firstWeight = 1 / (alphaPrime - 1);
  const secondWeight = 1 / (alphaDoublePrime - 1);
  const weightSum = 2 * firstWeight + 2 * secondWeight + 11;
  const epsilonPrime = (firstWeight * budget) / weightSum;
  const epsilonDoublePrime = (secondWeight * budget) / (2 * weightSum);
  const smoothingRest = (3 * budget) / weightSum;
  return {
    epsilonEA: budget,
    epsilonPA: (5 * budget) / weightSum,
    epsilonS: epsilonPrime + 2 * epsilonDoublePrime + smoothingRest,
    epsilonPrime,
    epsilonDoublePrime,
  };
}
