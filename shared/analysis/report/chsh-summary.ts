import { LOCAL_WIN_FRACTION } from '../statistics/bell-bounds';
import { log10BinomialUpperTail } from '../statistics/binomial-tail';
import { chshValue, correlator } from '../statistics/chsh-value';
import { hoeffdingDeviation } from '../statistics/hoeffding';
import { countCell } from '../tally/count-table';

/** The CHSH test over the test rounds with x, y ∈ {0, 1}. */
export interface ChshSummary {
  /** CHSH test rounds, m. */
  rounds: number;
  /** Rounds won (a ⊕ b = x·y), w. */
  wins: number;
  /** w/m, or null without rounds. */
  winFraction: number | null;
  /** Hoeffding lower bound at ε, ω̂ − sqrt(ln(1/ε)/(2m)), or null. */
  winFractionLower: number | null;
  /** S = E00 + E01 + E10 − E11 from the correlators, or null if a setting pair has no rounds. */
  S: number | null;
  /** The four correlators E_xy. */
  correlators: { E00: number | null; E01: number | null; E10: number | null; E11: number | null };
  /** Exact P(Bin(m, 3/4) ≥ w) against local models (may underflow to 0; see log10PValue). */
  pValue: number;
  /** log10 of that tail, exact in log space. */
  log10PValue: number;
  /** log10 of the Azuma–Hoeffding form exp(−2m(ω̂ − 3/4)²), 0 when ω̂ ≤ 3/4. */
  log10PValueHoeffding: number;
}

/**
 * The CHSH statistics of the test counts: wins by the CHSH rule (CHSH 1969), the Hoeffding lower
 * bound (Hoeffding 1963), the correlators, and the p-value against local models, the binomial tail
 * P(Bin(m, 3/4) ≥ w) (Gill 2003) and its Azuma–Hoeffding form.
 */
export function summariseChsh(test: readonly number[], epsilon: number): ChshSummary {
  let rounds = 0;
  let wins = 0;
  const pairCorrelator = (x: number, y: number) => {
    const same = test[countCell(x, y, 0, 0)] + test[countCell(x, y, 1, 1)];
    const different = test[countCell(x, y, 0, 1)] + test[countCell(x, y, 1, 0)];
    rounds += same + different;
    wins += x * y === 1 ? different : same;
    return correlator(same, different);
  };
  const correlators = { E00: pairCorrelator(0, 0), E01: pairCorrelator(0, 1), E10: pairCorrelator(1, 0), E11: pairCorrelator(1, 1) };
  const { E00, E01, E10, E11 } = correlators;
  const S = E00 === null || E01 === null || E10 === null || E11 === null ? null : chshValue(E00, E01, E10, E11);
  const winFraction = rounds === 0 ? null : wins / rounds;
  const log10PValue = log10BinomialUpperTail(wins, rounds, LOCAL_WIN_FRACTION);
  const excess = winFraction === null ? 0 : Math.max(winFraction - LOCAL_WIN_FRACTION, 0);
  return {
    rounds,
    wins,
    winFraction,
    winFractionLower: winFraction === null ? null : Math.max(0, winFraction - hoeffdingDeviation(rounds, epsilon)),
    S,
    correlators,
    pValue: 10 ** log10PValue,
    log10PValue,
    log10PValueHoeffding: (-2 * rounds * excess * excess) / Math.LN10,
  };
}
