/**
 * The third-order term, K = 2^((α′−1)R)·ln³(2^R + e²) / (6(2 − α′)³·ln 2), for α′ ∈ (1, 2) and
 * the spread R (Nadlinger et al., Nature 607, 682 (2022), Supplementary Proposition 2).
 */
export function thirdOrderTerm(alphaPrime: number, spread: number): number {
  return (2 ** ((alphaPrime - 1) * spread) * Math.log(2 ** spread + Math.E ** 2) ** 3) / (6 * (2 - alphaPrime) ** 3 * Math.LN2);
}
