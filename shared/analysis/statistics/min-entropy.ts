import { LOCAL_CHSH_VALUE, QUANTUM_CHSH_VALUE } from './bell-bounds';

/**
 * Min-entropy per round from the CHSH guessing probability, P_guess ≤ (1 + sqrt(2 − S²/4))/2, so
 * H_min ≥ 1 − log2(1 + sqrt(2 − S²/4)) (Pironio et al., Nature 464, 1021 (2010); Masanes, Pironio,
 * Acín, Nat. Commun. 2, 238 (2011)). At or below the local bound nothing is certified (0 bits); 2√2
 * certifies one full bit. Above 2√2 no quantum device exists to certify anything, and the bound is
 * refused rather than clipped: callers report such an S as broken data (see report/verdict.ts).
 *
 * @throws RangeError when S is above 2√2.
 */
export function minEntropyPerRound(chshValue: number): number {
  if (chshValue > QUANTUM_CHSH_VALUE) {
    throw new RangeError(`S = ${chshValue} is above the quantum bound 2√2: no min-entropy is defined for it`);
  }
  const s = Math.max(chshValue, LOCAL_CHSH_VALUE);
  return 1 - Math.log2(1 + Math.sqrt(Math.max(2 - (s * s) / 4, 0)));
}
