import { KeyLengthParameters, KeyLengthSetting } from './key-length-parameters';
import { secondOrderFloor } from './second-order-floor';
import { smoothingCost } from './smoothing-cost';
import { tangentAt, tangentValue } from './tangent';
import { thirdOrderTerm } from './third-order-term';
import { tradeoffSpread } from './tradeoff-spread';

/** (log2 5)², the per-round cost of α″ − 1. */
export const ALPHA_DOUBLE_PRIME_COST = Math.log2(5) ** 2;

/** Public bits of the protocol other than the syndrome (Nadlinger et al. 2022, Supplementary Proposition 2). */
const OTHER_PUBLIC_BITS = 264;

/**
 * The bit budget x whose Υ(x) is the key length (Nadlinger et al., Nature 607, 682 (2022),
 * arXiv:2109.14600, Supplementary Proposition 2, Eqs. 61–73):
 * x = n·g_t(ω_thr) + n·inf_ω[Δ(ω) − (α′−1)V(ω)] − n(α′−1)²K − nγ − n(α″−1)(log 5)²
 *     − [ϑ(ε′) + α′·log(1/ε_EA)]/(α′−1) − [ϑ(ε″) + α″·log(1/ε_EA)]/(α″−1)
 *     − 3ϑ(ε_s − ε′ − 2ε″) − 5·log(1/ε_PA) − m − 264.
 */
export function keyLengthBudget(setting: KeyLengthSetting, parameters: KeyLengthParameters): number {
  const { rounds: n, testProbability, omegaThreshold, syndromeBits } = setting;
  const { t, alphaPrime, alphaDoublePrime, epsilonPrime, epsilonDoublePrime, epsilonEA, epsilonPA, epsilonS } = parameters;
  const tangent = tangentAt(t);
  const accumulationCost = Math.log2(1 / epsilonEA);
  const perRound =
    tangentValue(tangent, omegaThreshold) +
    secondOrderFloor(tangent, testProbability, alphaPrime) -
    (alphaPrime - 1) ** 2 * thirdOrderTerm(alphaPrime, tradeoffSpread(tangent)) -
    testProbability -
    (alphaDoublePrime - 1) * ALPHA_DOUBLE_PRIME_COST;
  const fixedCosts =
    (smoothingCost(epsilonPrime) + alphaPrime * accumulationCost) / (alphaPrime - 1) +
    (smoothingCost(epsilonDoublePrime) + alphaDoublePrime * accumulationCost) / (alphaDoublePrime - 1) +
    3 * smoothingCost(epsilonS - epsilonPrime - 2 * epsilonDoublePrime) +
    5 * Math.log2(1 / epsilonPA) +
    syndromeBits +
    OTHER_PUBLIC_BITS;
  return n * perRound - fixedCosts;
}
