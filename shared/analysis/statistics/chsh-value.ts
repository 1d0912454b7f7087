/**
 * Correlator of one setting pair, E = (N_same − N_diff) / (N_same + N_diff), the mean of the product
 * of ±1 outcomes (Clauser, Horne, Shimony, Holt, PRL 23, 880 (1969)).
 *
 * @returns null when the setting pair has no rounds.
 */
export function correlator(same: number, different: number): number | null {
  const rounds = same + different;
  return rounds === 0 ? null : (same - different) / rounds;
}

/** CHSH value S = E00 + E01 + E10 − E11 (CHSH 1969); local bound 2, quantum bound 2√2. */
export function chshValue(e00: number, e01: number, e10: number, e11: number): number {
  return e00 + e01 + e10 - e11;
}

/**
 * CHSH value from the win fraction with uniform settings, S = 8ω − 4 (CHSH 1969, each of the four
 * setting pairs contributing a quarter of the rounds).
 */
export function chshValueFromWinFraction(winFraction: number): number {
  return 8 * winFraction - 4;
}

/** The inverse, ω = (S + 4)/8: the win fraction that gives CHSH value S. */
export function winFractionFromChshValue(chshValue: number): number {
  return (chshValue + 4) / 8;
}
