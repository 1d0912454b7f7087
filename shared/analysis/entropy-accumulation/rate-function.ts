import { QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { binaryEntropy } from '../statistics/binary-entropy';

/**
 * Smallest CHSH win probability quantum devices reach, ω_min = (1 − 1/√2)/2 = 1 − ω_Q (Tsirelson,
 * Lett. Math. Phys. 4, 93 (1980)); the largest, ω_max, is ω_Q = QUANTUM_WIN_FRACTION.
 */
export const LOWEST_QUANTUM_WIN_FRACTION = 1 - QUANTUM_WIN_FRACTION;

/**
 * sqrt(16ω(ω−1) + 3), which is sqrt((S/2)² − 1) with S = 8ω − 4; 0 on [¼, ¾], where the
 * radicand is negative and no entropy is certified.
 */
export function chshMargin(winProbability: number): number {
  return Math.sqrt(Math.max(16 * winProbability * (winProbability - 1) + 3, 0));
}

/**
 * Rate function of the entropy accumulation bound, the von Neumann entropy per round certified by
 * the CHSH win probability ω: η(ω) = 1 − h(½ + ½·sqrt(16ω(ω−1) + 3)) on [ω_min, ω_max], 0 on
 * [¼, ¾] (Nadlinger et al., Nature 607, 682 (2022), arXiv:2109.14600, Supplementary Proposition 2; the
 * curve of Pironio et al., NJP 11, 045021 (2009), written in ω).
 */
export function rateFunction(winProbability: number): number {
  return 1 - binaryEntropy((1 + chshMargin(winProbability)) / 2);
}

/**
 * Its derivative, η′(ω) = (8ω − 4)·log2((1 + s)/(1 − s))/s with s = sqrt(16ω(ω−1) + 3)
 * (the chain rule on η, with h′(p) = log2((1 − p)/p)). At ω = ¾, where η has a kink, it is the
 * right-hand slope 4/ln 2 (ln((1 + s)/(1 − s))/s tends to 2 as s → 0): the tangent points lie in
 * [¾, ω_max). 0 inside (¼, ¾); it diverges at ω_max.
 */
export function rateFunctionSlope(winProbability: number): number {
  if (winProbability > 0.25 && winProbability < 0.75) {
    return 0;
  }
  const s = chshMargin(winProbability);
  const logRatioOverS = s === 0 ? 2 : (Math.log1p(s) - Math.log1p(-s)) / s;
  return ((8 * winProbability - 4) * logRatioOverS) / Math.LN2;
}
