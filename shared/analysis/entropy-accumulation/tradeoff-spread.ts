import { LOWEST_QUANTUM_WIN_FRACTION } from './rate-function';
import { Tangent, tangentValue } from './tangent';

/**
 * R = 2 + g_t(1) − g_t(ω_min), the range term of the third-order correction (Nadlinger et al.,
 * Nature 607, 682 (2022), Supplementary Proposition 2).
 */
export function tradeoffSpread(tangent: Tangent): number {
  return 2 + tangentValue(tangent, 1) - tangentValue(tangent, LOWEST_QUANTUM_WIN_FRACTION);
}
