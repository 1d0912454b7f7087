import { rateFunction, rateFunctionSlope } from './rate-function';

/** The tangent to the rate function at one point t: g_t(ω) = value + (ω − t)·slope. */
export interface Tangent {
  /** The tangent point t ∈ [¾, ω_max). */
  point: number;
  /** η(t). */
  value: number;
  /** η′(t). */
  slope: number;
}

/** The tangent to η at t (Nadlinger et al., Nature 607, 682 (2022), Supplementary Proposition 2). */
export function tangentAt(point: number): Tangent {
  return { point, value: rateFunction(point), slope: rateFunctionSlope(point) };
}

/**
 * g_t(ω) = η(t) + (ω − t)·η′(t) (Nadlinger et al. 2022, Supplementary Proposition 2). η is convex on
 * [¾, ω_max], so the tangent never lies above it: g_t ≤ η on [ω_min, ω_max].
 */
export function tangentValue(tangent: Tangent, winProbability: number): number {
  return tangent.value + (winProbability - tangent.point) * tangent.slope;
}
