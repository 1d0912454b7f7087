import { MinTradeoffValues } from './min-tradeoff-function';

/**
 * Variance of the min-tradeoff function under q(ω) = (γ(1−ω), γω, 1−γ) on (0, 1, ⊥),
 * Var_q(f_t) = Σ_c q(c)·(f_t(c) − E_q f_t)² (Nadlinger et al., Nature 607, 682 (2022),
 * Supplementary Proposition 2). Summed about the mean rather than as E f² − (E f)², because f_t(0)
 * grows like 1/γ.
 */
export function minTradeoffVariance(values: MinTradeoffValues, testProbability: number, winProbability: number): number {
  const lostWeight = testProbability * (1 - winProbability);
  const wonWeight = testProbability * winProbability;
  const untestedWeight = 1 - testProbability;
  const mean = lostWeight * values.lost + wonWeight * values.won + untestedWeight * values.untested;
  return lostWeight * (values.lost - mean) ** 2 + wonWeight * (values.won - mean) ** 2 + untestedWeight * (values.untested - mean) ** 2;
}
