import { rateFunction } from './rate-function';
import { Tangent, tangentValue } from './tangent';

/**
 * Δ(ω) = η(ω) − g_t(ω), how far the rate function lies above its tangent at t (Nadlinger et al.,
 * Nature 607, 682 (2022), Supplementary Proposition 2). Never negative on [ω_min, ω_max]; 0 at t.
 */
export function tangentGap(tangent: Tangent, winProbability: number): number {
  return rateFunction(winProbability) - tangentValue(tangent, winProbability);
}
