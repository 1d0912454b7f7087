import { binaryEntropy } from './binary-entropy';
import { minEntropyPerRound } from './min-entropy';

/** Inputs of the finite-key estimate; every quantity as in the formula below. */
export interface FiniteKeyInputs {
  /** Raw key bits n (untested rounds with the key setting). */
  rawBits: number;
  /** Lower confidence bound on the CHSH value, S_low. */
  chshValueLower: number;
  /** Upper confidence bound on the error rate of the raw key, Q_up (clamped to 1/2). */
  qberUpper: number;
  /** Reconciliation efficiency f (common practice 1.1–1.2, no source). */
  reconciliationEfficiency: number;
  /** Failure probability of error correction, ε_EC. */
  epsilonEC: number;
  /** Failure probability of privacy amplification, ε_PA. */
  epsilonPA: number;
}

/**
 * Finite key length against collective (i.i.d.) attacks,
 * ℓ = ⌊ n·(1 − log2(1 + sqrt(2 − S_low²/4))) − f·n·h(Q_up) − log2(2/ε_EC) − 2·log2(1/ε_PA) ⌋
 * (min-entropy per round: Pironio et al., Nature 464, 1021 (2010)); f·n·h(Q_up) is the leakage of
 * error correction, the last two terms the usual costs of verifying error correction and of privacy
 * amplification. ℓ ≤ 0 means no key.
 */
export function finiteKeyLength(inputs: FiniteKeyInputs): number {
  const n = inputs.rawBits;
  const entropy = n * minEntropyPerRound(inputs.chshValueLower);
  const leakage = inputs.reconciliationEfficiency * n * binaryEntropy(Math.min(inputs.qberUpper, 0.5));
  const correctionCost = Math.log2(2 / inputs.epsilonEC);
  const amplificationCost = 2 * Math.log2(1 / inputs.epsilonPA);
  return Math.floor(entropy - leakage - correctionCost - amplificationCost);
}
