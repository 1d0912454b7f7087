import { hoeffdingDeviation } from '../statistics/hoeffding';
import { BLOCK_ROUNDS, BLOCK_STATS } from '../tally/round-tally';

/** An observed fraction with its Hoeffding interval (each side holds except with probability ε). */
export interface FractionInterval {
  /** Rounds behind it. */
  rounds: number;
  /** Rounds counted (wins, or errors). */
  hits: number;
  /** hits/rounds, or null without rounds. */
  fraction: number | null;
  /** Lower end, clamped to [0, 1]. */
  lower: number | null;
  /** Upper end, clamped to [0, 1]. */
  upper: number | null;
}

/** One block of consecutive rounds, for the stationarity plot. */
export interface BlockSummary {
  /** 0-based block number. */
  index: number;
  /** First and last round index in the block (null when it holds no valid round). */
  firstRound: number | null;
  lastRound: number | null;
  /** CHSH win fraction over the block's test rounds. */
  chsh: FractionInterval;
  /** Error rate on the key setting over the block's test rounds. */
  qber: FractionInterval;
}

/** A fraction with its two-sided Hoeffding interval (Hoeffding 1963). */
export function fractionInterval(rounds: number, hits: number, epsilon: number): FractionInterval {
  if (rounds === 0) {
    return { rounds, hits, fraction: null, lower: null, upper: null };
  }
  const fraction = hits / rounds;
  const deviation = hoeffdingDeviation(rounds, epsilon);
  return { rounds, hits, fraction, lower: Math.max(0, fraction - deviation), upper: Math.min(1, fraction + deviation) };
}

/** The per-block summaries from the tallied block statistics. */
export function blockSummaries(blockStats: readonly number[], blockRounds: readonly number[], epsilon: number): BlockSummary[] {
  const count = blockStats.length / BLOCK_STATS;
  return Array.from({ length: count }, (_, index) => {
    const stats = index * BLOCK_STATS;
    const rounds = index * BLOCK_ROUNDS;
    return {
      index,
      firstRound: Number.isNaN(blockRounds[rounds]) ? null : blockRounds[rounds],
      lastRound: Number.isNaN(blockRounds[rounds + 1]) ? null : blockRounds[rounds + 1],
      chsh: fractionInterval(blockStats[stats], blockStats[stats + 1], epsilon),
      qber: fractionInterval(blockStats[stats + 2], blockStats[stats + 3], epsilon),
    };
  });
}
