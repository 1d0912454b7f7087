import { ALPHA_DOUBLE_PRIME_COST } from './key-length-budget';

/** Upper end of α″'s range, 1 + 1/log2 5, kept strictly inside. */
const LARGEST_EXCESS = (1 / Math.log2(5)) * (1 - 1e-9);

/**
 * The α″ that gives the longest key for given n, ε″, ε_EA. α″ enters the key length (Nadlinger et
 * al., Nature 607, 682 (2022), Supplementary Proposition 2) only through
 * −n·d·(log 5)² − [ϑ(ε″) + log(1/ε_EA)]/d − log(1/ε_EA), d = α″ − 1, whose maximum is at
 * d = sqrt([ϑ(ε″) + log(1/ε_EA)] / (n·(log 5)²)), capped at the end of the range (1, 1 + 1/log 5).
 */
export function bestAlphaDoublePrime(rounds: number, smoothingCostDoublePrime: number, epsilonEA: number): number {
  const excess = Math.sqrt((smoothingCostDoublePrime + Math.log2(1 / epsilonEA)) / (rounds * ALPHA_DOUBLE_PRIME_COST));
  return 1 + Math.min(excess, LARGEST_EXCESS);
}
