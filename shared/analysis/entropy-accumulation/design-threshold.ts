import { winFractionFromChshValue } from '../statistics/chsh-value';

/**
 * Acceptance threshold of the design, ω_thr = 1 − q_thr/γ with q_thr = q + 3·sqrt(q(1−q)/n),
 * q = γ(1−ω), ω = (4+S)/8: the expected share of lost test rounds plus three standard deviations
 * (Nadlinger et al., Nature 607, 682 (2022), arXiv:2109.14600, Supplementary Information, design
 * choices of that run).
 */
export function designThreshold(rounds: number, testProbability: number, chshValue: number): number {
  const lostShare = testProbability * (1 - winFractionFromChshValue(chshValue));
  const lostShareThreshold = lostShare + 3 * Math.sqrt((lostShare * (1 - lostShare)) / rounds);
  return 1 - lostShareThreshold / testProbability;
}
