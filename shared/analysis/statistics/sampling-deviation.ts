/**
 * Deviation for sampling without replacement: with a uniformly random test subset of `tested` rounds
 * and `untested` other rounds, the error rate of the untested ones is at most the tested rate plus
 * μ = sqrt( (n+k)/(n·k) · (k+1)/k · ln(1/ε) ) except with probability ε, n untested and k tested
 * (Serfling, Ann. Stat. 2, 39 (1974); this form: Tomamichel, Lim, Gisin, Renner, Nat. Commun. 3, 634 (2012)).
 *
 * @returns Infinity when either side is empty.
 */
export function samplingDeviation(tested: number, untested: number, epsilon: number): number {
  if (tested <= 0 || untested <= 0) {
    return Infinity;
  }
  const populationFactor = (untested + tested) / (untested * tested);
  const smallSampleFactor = (tested + 1) / tested;
  return Math.sqrt(populationFactor * smallSampleFactor * Math.log(1 / epsilon));
}
