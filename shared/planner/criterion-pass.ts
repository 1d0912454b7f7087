import type { AnalysisProfile } from '../analysis/profile';
import { summariseChsh } from '../analysis/report/chsh-summary';
import { summariseQber } from '../analysis/report/qber-summary';
import { chshCriterion, qberCriterion } from '../analysis/report/verdict';
import { log10BinomialUpperTail } from '../analysis/statistics/binomial-tail';
import { COUNT_CELLS, countCell } from '../analysis/tally/count-table';
import { firstIndexWhere } from './monotone-search';

/**
 * Probability that the CHSH criterion passes with `rounds` CHSH test rounds each won with
 * probability ω: P(W ≥ w*) for W ~ Bin(rounds, ω), where w* is the fewest wins the engine's own
 * criterion (`chshCriterion` on `summariseChsh`) accepts; under the general model with the
 * threshold ω_thr of `generalThreshold`.
 */
export function chshPassProbability(rounds: number, winFraction: number, profile: AnalysisProfile, generalThreshold?: number): number {
  const passes = (wins: number) =>
    chshCriterion(summariseChsh(tableWith(countCell(0, 0, 0, 0), wins, countCell(0, 0, 0, 1), rounds - wins), profile.epsilon), profile, generalThreshold).passes;
  const fewest = firstIndexWhere(0, rounds, passes);
  return fewest === null ? 0 : 10 ** log10BinomialUpperTail(fewest, rounds, winFraction);
}

/**
 * Probability that the error-rate criterion passes with `rounds` key-setting test rounds each in
 * error with probability QBER: P(E ≤ e*) for E ~ Bin(rounds, QBER), where e* is the most errors
 * the engine's own criterion (`qberCriterion` on `summariseQber`) accepts.
 */
export function qberPassProbability(rounds: number, qber: number, profile: AnalysisProfile): number {
  const empty = new Array<number>(COUNT_CELLS).fill(0);
  const fails = (errors: number) => !qberCriterion(summariseQber(tableWith(countCell(0, 2, 0, 1), errors, countCell(0, 2, 0, 0), rounds - errors), empty, profile.epsilon), profile).passes;
  const fewestFailing = firstIndexWhere(0, rounds, fails);
  if (fewestFailing === null) return 1;
  return -Math.expm1(log10BinomialUpperTail(fewestFailing, rounds, qber) * Math.LN10);
}

/** A count table holding two cells. */
function tableWith(cell: number, count: number, otherCell: number, otherCount: number): number[] {
  const table = new Array<number>(COUNT_CELLS).fill(0);
  table[cell] = count;
  table[otherCell] = otherCount;
  return table;
}
