import { intervalMinimum } from './interval-minimum';
import { minTradeoffValues } from './min-tradeoff-function';
import { minTradeoffVariance } from './min-tradeoff-variance';
import { QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { LOWEST_QUANTUM_WIN_FRACTION } from './rate-function';
import { Tangent } from './tangent';
import { tangentGap } from './tangent-gap';
import { varianceTerm } from './variance-term';

// Δ − (α′−1)V is smooth away from the kinks of η at ¼ and ¾ and has one basin, just below t
// (Δ is 0 at t and grows quadratically; V shrinks as ω grows). 64 grid points on [ω_min, ω_max]
// (spacing 0.011) resolve that basin; the refinement places the minimum to 1e-9, where the value
// is within 1e-16 of the infimum (it is quadratic there).
const FLOOR_SEARCH = { gridPoints: 64, tolerance: 1e-9 };

/**
 * inf over ω ∈ [ω_min, ω_max] of Δ(ω) − (α′−1)·V(ω), V evaluated at Var_q(ω)(f_t): the worst-case
 * second-order correction per round of the entropy accumulation bound (Nadlinger et al., Nature 607,
 * 682 (2022), Supplementary Proposition 2). Found by a grid scan and golden-section refinement
 * (`intervalMinimum`).
 */
export function secondOrderFloor(tangent: Tangent, testProbability: number, alphaPrime: number): number {
  const values = minTradeoffValues(tangent, testProbability);
  const correction = (winProbability: number) =>
    tangentGap(tangent, winProbability) - (alphaPrime - 1) * varianceTerm(minTradeoffVariance(values, testProbability, winProbability));
  return intervalMinimum(correction, LOWEST_QUANTUM_WIN_FRACTION, QUANTUM_WIN_FRACTION, FLOOR_SEARCH).value;
}
