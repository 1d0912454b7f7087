import { binaryEntropy } from '../statistics/binary-entropy';

/**
 * Error-correction syndrome length of the design, m = ⌊n[(1−γ)·h(Q) + γ·h((4−S)/8)] + 50·√n⌋: the
 * key-setting rounds leak h(Q) per round, the test rounds the CHSH losses h((4−S)/8), and 50·√n is
 * the design's margin (Nadlinger et al., Nature 607, 682 (2022), arXiv:2109.14600, Supplementary
 * Information, design choices of that run).
 */
export function designSyndromeLength(rounds: number, testProbability: number, chshValue: number, qber: number): number {
  const leakagePerRound = (1 - testProbability) * binaryEntropy(qber) + testProbability * binaryEntropy((4 - chshValue) / 8);
  return Math.floor(rounds * leakagePerRound + 50 * Math.sqrt(rounds));
}
