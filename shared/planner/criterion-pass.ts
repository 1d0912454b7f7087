import type { AnalysisProfile } from '../analysis/profile';
import { CHSH_PAIRS, summariseChsh } from '../analysis/report/chsh-summary';
import { summariseQber } from '../analysis/report/qber-summary';
import { chshRulesHold, qberCriterion } from '../analysis/report/verdict';
import { QUANTUM_WIN_FRACTION } from '../analysis/statistics/bell-bounds';
import { log10BinomialUpperTail } from '../analysis/statistics/binomial-tail';
import { COUNT_CELLS, countCell } from '../analysis/tally/count-table';
import { firstIndexWhere } from './monotone-search';

/**
 * Probability that the CHSH rules pass with `rounds` CHSH test rounds each won with probability ω:
 * P(W ≥ w*) for W ~ Bin(rounds, ω), where w* is the fewest wins the engine's own rules
 * (`chshRulesHold` on `summariseChsh`: the criterion, a significant violation, the quantum bound)
 * accept, the rounds and wins split evenly over the four setting pairs as the design expects;
 * under the general model with the threshold ω_thr of `generalThreshold`, the acceptance count
 * taken at the expected test rounds. The passing wins form an interval [w*, w⁺): from w⁺ on the
 * lower bound is above the quantum maximum, which fails, so the probability is P(W ≥ w*) − P(W ≥ w⁺).
 */
export function chshPassProbability(rounds: number, winFraction: number, profile: AnalysisProfile, generalThreshold?: number): number {
  const general = generalThreshold === undefined ? null : { rounds, testProbability: 1, omegaThreshold: generalThreshold };
  const summary = (wins: number) => summariseChsh(evenPairs(rounds, wins), new Array<number>(COUNT_CELLS).fill(0), profile.epsilon);
  const aboveQuantum = (wins: number) => (summary(wins).winFractionLower ?? 0) > QUANTUM_WIN_FRACTION;
  const fewest = firstIndexWhere(0, rounds, (wins) => aboveQuantum(wins) || chshRulesHold(summary(wins), profile, general));
  if (fewest === null || !chshRulesHold(summary(fewest), profile, general)) return 0;
  const tooMany = firstIndexWhere(fewest, rounds, aboveQuantum);
  const tail = (wins: number) => 10 ** log10BinomialUpperTail(wins, rounds, winFraction);
  return tail(fewest) - (tooMany === null ? 0 : tail(tooMany));
}

/** A test table of `rounds` CHSH rounds and `wins` wins, both split evenly over the four setting pairs. */
function evenPairs(rounds: number, wins: number): number[] {
  const table = new Array<number>(COUNT_CELLS).fill(0);
  for (const { x, y } of CHSH_PAIRS) {
    const [win, loss] = x * y === 1 ? [countCell(x, y, 0, 1), countCell(x, y, 0, 0)] : [countCell(x, y, 0, 0), countCell(x, y, 0, 1)];
    table[win] = wins / 4;
    table[loss] = (rounds - wins) / 4;
  }
  return table;
}

/**
 * Probability that the error-rate criterion passes with `rounds` key-setting test rounds each in
 * error with probability QBER: P(E ≤ e*) for E ~ Bin(rounds, QBER), where e* is the most errors
 * the engine's own criterion (`qberCriterion` on `summariseQber`) accepts.
 */
export function qberPassProbability(rounds: number, qber: number, profile: AnalysisProfile): number {
  const empty = new Array<number>(COUNT_CELLS).fill(0);
  const fails = (errors: number) =>
    !qberCriterion(summariseQber(tableWith(countCell(0, 2, 0, 1), errors, countCell(0, 2, 0, 0), rounds - errors), empty, profile.epsilon), profile).passes;
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
