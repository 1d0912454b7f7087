/** log2 33. */
const LOG_33 = Math.log2(33);

/**
 * The second-order term of the entropy accumulation bound, V = (ln 2/2)·(log2 33 + sqrt(2 + Var))²,
 * Var the variance of the min-tradeoff function (Nadlinger et al., Nature 607, 682 (2022),
 * Supplementary Proposition 2).
 */
export function varianceTerm(variance: number): number {
  return (Math.LN2 / 2) * (LOG_33 + Math.sqrt(2 + variance)) ** 2;
}
