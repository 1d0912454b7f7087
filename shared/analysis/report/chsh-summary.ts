import { LOCAL_WIN_FRACTION } from '../statistics/bell-bounds';
import { balancedHoeffdingDeviation, balancedWinFractionWithLosses, log10BalancedLocalTail, PairTally } from '../statistics/balanced-win-fraction';
import { log10BinomialUpperTail } from '../statistics/binomial-tail';
import { chshValue, correlator } from '../statistics/chsh-value';
import { hoeffdingDeviation } from '../statistics/hoeffding';
import { countCell } from '../tally/count-table';

/** The CHSH setting pairs, in the order of the result's table. */
export const CHSH_PAIRS: ReadonlyArray<{ x: 0 | 1; y: 0 | 1 }> = [
  { x: 0, y: 0 },
  { x: 0, y: 1 },
  { x: 1, y: 0 },
  { x: 1, y: 1 },
];

/** One CHSH setting pair's rounds and test figures. */
export interface SettingPairFigures {
  x: 0 | 1;
  y: 0 | 1;
  /** Rounds of the pair in the log, tested or not. */
  rounds: number;
  /** Test rounds of the pair. */
  testRounds: number;
  /** Test rounds won (a ⊕ b = x·y). */
  wins: number;
  /** wins/testRounds, or null without test rounds. */
  winFraction: number | null;
  /** The pair's own Hoeffding lower bound at ε, or null. */
  winFractionLower: number | null;
}

/** The CHSH test over the test rounds with x, y ∈ {0, 1}. */
export interface ChshSummary {
  /** CHSH test rounds in the log, m. */
  rounds: number;
  /** Rounds won among them, w. */
  wins: number;
  /** Triggers missing from the log that were drawn for testing, each counted as a lost CHSH game. */
  missingTestRounds: number;
  /** w/m, for reference only: it can gain from unequal setting shares, so nothing is judged on it. */
  pooledWinFraction: number | null;
  /**
   * The win fraction judged: the four setting pairs at equal weights (`balancedWinFraction`), the
   * missing test rounds added as losses where they lower it most; null when a pair has no test rounds.
   */
  winFraction: number | null;
  /** Its Hoeffding lower bound at ε (`balancedHoeffdingDeviation`), or null. */
  winFractionLower: number | null;
  /** S = E00 + E01 + E10 − E11 from the correlators, or null if a setting pair has no rounds. */
  S: number | null;
  /** The four correlators E_xy. */
  correlators: { E00: number | null; E01: number | null; E10: number | null; E11: number | null };
  /** 10^log10PValue (0 when it underflows; see log10PValue). */
  pValue: number;
  /** log10 of the p-value against local models: the larger (weaker) of the two bounds below. */
  log10PValue: number;
  /** log10 P(Bin(m + missing, ¾) ≥ w), exact in log space (Gill 2003; valid with uniform settings in the test set). */
  log10PValueBinomial: number;
  /** log10 of the balanced estimator's Hoeffding tail at ¾, valid whatever the setting shares of the test set. */
  log10PValueHoeffding: number;
  /** The four setting pairs, in `CHSH_PAIRS` order. */
  pairs: SettingPairFigures[];
}

/**
 * The CHSH statistics of the count tables. Every figure that is judged is robust to the setting
 * shares of the test set: the win fraction weighs the four pairs equally (S from the four
 * correlators, CHSH 1969), its bound is Hoeffding's for that estimator (Hoeffding 1963, Theorem 2),
 * and the p-value against local models is the weaker of the binomial tail P(Bin(m, ¾) ≥ w) (Gill
 * 2003) and the balanced estimator's Hoeffding tail. Missing test rounds count as lost games.
 */
export function summariseChsh(test: readonly number[], generation: readonly number[], epsilon: number, missingTestRounds = 0): ChshSummary {
  const pairs = CHSH_PAIRS.map(({ x, y }) => pairFigures(test, generation, x, y, epsilon));
  const tallies: PairTally[] = pairs.map((pair) => ({ rounds: pair.testRounds, wins: pair.wins }));
  const rounds = sum(pairs.map((pair) => pair.testRounds));
  const wins = sum(pairs.map((pair) => pair.wins));
  const [E00, E01, E10, E11] = CHSH_PAIRS.map(({ x, y }) => correlator(sameOutcomes(test, x, y), differentOutcomes(test, x, y)));
  const S = E00 === null || E01 === null || E10 === null || E11 === null ? null : chshValue(E00, E01, E10, E11);
  const winFraction = balancedWinFractionWithLosses(tallies, missingTestRounds);
  const pairRounds = pairs.map((pair) => pair.testRounds);
  const deviation = balancedHoeffdingDeviation(pairRounds, epsilon);
  const log10PValueBinomial = log10BinomialUpperTail(wins, rounds + missingTestRounds, LOCAL_WIN_FRACTION);
  const log10PValueHoeffding = winFraction === null ? 0 : log10BalancedLocalTail(winFraction, pairRounds);
  const log10PValue = Math.max(log10PValueBinomial, log10PValueHoeffding);
  return {
    rounds,
    wins,
    missingTestRounds,
    pooledWinFraction: rounds === 0 ? null : wins / rounds,
    winFraction,
    winFractionLower: winFraction === null || !Number.isFinite(deviation) ? null : Math.max(0, winFraction - deviation),
    S,
    correlators: { E00, E01, E10, E11 },
    pValue: 10 ** log10PValue,
    log10PValue,
    log10PValueBinomial,
    log10PValueHoeffding,
    pairs,
  };
}

/** Rounds and wins (a ⊕ b = x·y) of one CHSH setting pair in a count table. */
export function pairWins(table: readonly number[], x: number, y: number): PairTally {
  const same = sameOutcomes(table, x, y);
  const different = differentOutcomes(table, x, y);
  return { rounds: same + different, wins: x * y === 1 ? different : same };
}

function pairFigures(test: readonly number[], generation: readonly number[], x: 0 | 1, y: 0 | 1, epsilon: number): SettingPairFigures {
  const { rounds: testRounds, wins } = pairWins(test, x, y);
  const winFraction = testRounds === 0 ? null : wins / testRounds;
  return {
    x,
    y,
    rounds: testRounds + pairWins(generation, x, y).rounds,
    testRounds,
    wins,
    winFraction,
    winFractionLower: winFraction === null ? null : Math.max(0, winFraction - hoeffdingDeviation(testRounds, epsilon)),
  };
}

function sameOutcomes(table: readonly number[], x: number, y: number): number {
  return table[countCell(x, y, 0, 0)] + table[countCell(x, y, 1, 1)];
}

function differentOutcomes(table: readonly number[], x: number, y: number): number {
  return table[countCell(x, y, 0, 1)] + table[countCell(x, y, 1, 0)];
}

function sum(values: readonly number[]): number {
  return values.reduce((total, value) => total + value, 0);
}
