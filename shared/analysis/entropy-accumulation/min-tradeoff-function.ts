import { Tangent, tangentValue } from './tangent';

/** The min-tradeoff function's value on each value of the round's register C. */
export interface MinTradeoffValues {
  /** f_t(0): a test round whose CHSH game was lost. */
  lost: number;
  /** f_t(1): a test round whose CHSH game was won. */
  won: number;
  /** f_t(⊥): a round that was not tested. */
  untested: number;
}

/**
 * The min-tradeoff function built from the tangent g_t: f_t(0) = g_t(0)/γ + (1 − 1/γ)·g_t(1),
 * f_t(1) = f_t(⊥) = g_t(1) (Nadlinger et al., Nature 607, 682 (2022), Supplementary Proposition 2). Its
 * mean under q(ω) = (γ(1−ω), γω, 1−γ) is g_t(ω).
 */
export function minTradeoffValues(tangent: Tangent, testProbability: number): MinTradeoffValues {
  const atWon = tangentValue(tangent, 1);
  const atLost = tangentValue(tangent, 0) / testProbability + (1 - 1 / testProbability) * atWon;
  return { lost: atLost, won: atWon, untested: atWon };
}
