import { LOCAL_CHSH_VALUE, QUANTUM_CHSH_VALUE } from './bell-bounds';

/**
 * Min-entropy per round from the CHSH guessing probability, P_guess ≤ (1 + sqrt(2 − S²/4))/2, so
 * H_min ≥ 1 − log2(1 + sqrt(2 − S²/4)) (Pironio et al., Nature 464, 1021 (2010); Masanes, Pironio,
 * Acín, Nat. Commun. 2, 238 (2011)). S is clamped to [2, 2√2]: at or below the local bound nothing is
 * certified (0 bits), and 2√2 certifies one full bit.
 */
export function minEntropyPerRound(chshValue: number): number {
  const s = Math.min(Math.max(chshValue, LOCAL_CHSH_VALUE), QUANTUM_CHSH_VALUE);
  return 1 - Math.log2(1 + Math.sqrt(Math.max(2 - (s * s) / 4, 0)));
}
