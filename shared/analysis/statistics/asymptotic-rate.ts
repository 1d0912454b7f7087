import { binaryEntropy } from './binary-entropy';
import { LOCAL_CHSH_VALUE, QUANTUM_CHSH_VALUE } from './bell-bounds';

/**
 * Asymptotic key rate per raw key bit against collective attacks,
 * r = 1 − h(Q) − h( (1 + sqrt((S/2)² − 1)) / 2 ), valid for 2 < S ≤ 2√2 (Acín et al., PRL 98,
 * 230501 (2007); Pironio et al., NJP 11, 045021 (2009)). S at or below 2 leaves Eve full knowledge
 * (the second entropy is 1); S above 2√2, possible only by statistical fluctuation, is taken as 2√2.
 * The value is returned as is: zero or below means no key.
 */
export function asymptoticRate(chshValue: number, qber: number): number {
  const s = Math.min(chshValue, QUANTUM_CHSH_VALUE);
  const eveEntropy = s <= LOCAL_CHSH_VALUE ? 1 : binaryEntropy((1 + Math.sqrt(Math.max((s / 2) ** 2 - 1, 0))) / 2);
  return 1 - binaryEntropy(qber) - eveEntropy;
}
