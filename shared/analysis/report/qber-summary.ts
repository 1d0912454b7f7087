import { hoeffdingDeviation } from '../statistics/hoeffding';
import { samplingDeviation } from '../statistics/sampling-deviation';
import { countCell } from '../tally/count-table';

/** The agreement test on the key setting (x = 0, y = 2). */
export interface QberSummary {
  /** Key-setting test rounds, k. */
  rounds: number;
  /** Disagreements among them, e. */
  errors: number;
  /** e/k, or null without rounds. */
  rate: number | null;
  /** Hoeffding upper bound at ε, Q̂ + sqrt(ln(1/ε)/(2k)), clamped to 1, or null. */
  rateUpper: number | null;
  /** Untested key-setting rounds, n (the raw key). */
  untestedRounds: number;
  /** Sampling-without-replacement bound for the untested rounds, Q̂ + μ, clamped to 1, or null. */
  untestedRateUpper: number | null;
}

/** Rounds and disagreements of the key setting in a count table. */
export function keySettingCounts(table: readonly number[]): { rounds: number; errors: number } {
  const agree = table[countCell(0, 2, 0, 0)] + table[countCell(0, 2, 1, 1)];
  const errors = table[countCell(0, 2, 0, 1)] + table[countCell(0, 2, 1, 0)];
  return { rounds: agree + errors, errors };
}

/**
 * The error rate of the key setting on test rounds with its Hoeffding bound (Hoeffding 1963) and
 * the bound for the untested key rounds by sampling without replacement (Serfling 1974; Tomamichel
 * et al. 2012).
 */
export function summariseQber(test: readonly number[], generation: readonly number[], epsilon: number): QberSummary {
  const { rounds, errors } = keySettingCounts(test);
  const untestedRounds = keySettingCounts(generation).rounds;
  const rate = rounds === 0 ? null : errors / rounds;
  const bounded = (deviation: number) => (rate === null || !Number.isFinite(deviation) ? null : Math.min(1, rate + deviation));
  return {
    rounds,
    errors,
    rate,
    rateUpper: bounded(hoeffdingDeviation(rounds, epsilon)),
    untestedRounds,
    untestedRateUpper: bounded(samplingDeviation(rounds, untestedRounds, epsilon)),
  };
}
