/**
 * ϑ(ε) = log2(1/(1 − sqrt(1 − ε²))), the cost in bits of smoothing with parameter ε (Nadlinger et
 * al., Nature 607, 682 (2022), Supplementary Proposition 2). 1 − sqrt(1 − ε²) is computed as
 * ε²/(1 + sqrt(1 − ε²)): the plain difference is 0 in doubles for ε below about 1e-8.
 */
export function smoothingCost(epsilon: number): number {
  const epsilonSquared = epsilon * epsilon;
  return -Math.log2(epsilonSquared / (1 + Math.sqrt(1 - epsilonSquared)));
}
