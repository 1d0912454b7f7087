/** ε_h = 2^−61, the hashing failure probability, counted four times in the soundness (Nadlinger et al., Nature 607, 682 (2022), Supplementary Proposition 2). */
export const HASH_FAILURE = 2 ** -61;

/** Soundness of the protocol, max(ε_EA, ε_PA + 2ε_s) + 4ε_h (Nadlinger et al. 2022, Supplementary Proposition 2). */
export function protocolSoundness(epsilonEA: number, epsilonPA: number, epsilonS: number): number {
  return Math.max(epsilonEA, epsilonPA + 2 * epsilonS) + 4 * HASH_FAILURE;
}
