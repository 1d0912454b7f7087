import { chshValueDeviation } from './chsh-value-deviation';
import { OffsetFit, OffsetScan } from './offset-scan';

/**
 * α, the chance the rule names a shift where none fits better, whatever the records (under its
 * assumption of rounds independent given their settings). 10^−6: a false alarm sends a lab hunting
 * for a shift that is not there, so the rule asks for strong evidence (chosen here, no source).
 */
export const ALIGNMENT_SIGNIFICANCE = 1e-6;

/** |S| never exceeds 4, each of its four correlators lying in [−1, 1]: the upper end of an interval without rounds. */
const LARGEST_ABSOLUTE_S = 4;

/** What one pairing's CHSH value says, with its simultaneous confidence interval for |S|. */
export interface OffsetEvidence {
  /** k: A's round r paired with B's round r + k. */
  offset: number;
  /** The observed S, or null when a setting pair has no rounds. */
  chshValue: number | null;
  /** The two-sided Hoeffding deviation t of S at this pairing (Infinity without rounds). */
  deviation: number;
  /** max(0, |Ŝ| − t) and min(4, |Ŝ| + t): where |S| lies, all offsets at once with probability 1 − α. */
  lower: number;
  upper: number;
}

/** The decision on a scan: does another offset fit clearly better than the centre? */
export interface AlignmentDecision {
  /** The centre the others are compared with (the stated offset, or 0). */
  centre: number;
  /** α of the rule. */
  significance: number;
  /** Every pairing, in increasing offset: the chart's series. */
  series: OffsetEvidence[];
  /** The centre's pairing. */
  atCentre: OffsetEvidence;
  /** The other pairing whose |S| has the highest lower bound (then the largest |Ŝ|). */
  best: OffsetEvidence;
  /** Whether `best` fits clearly better than the centre: its lower bound above the centre's upper bound. */
  shifted: boolean;
}

/**
 * The rule: with δ = α/(2R + 1) for the 2R + 1 pairings scanned, each pairing's |S| lies within
 * |Ŝ| ± t (`chshValueDeviation` at δ) for all pairings at once with probability at least 1 − α
 * (union bound: Bonferroni; Dunn, J. Am. Stat. Assoc. 56, 52 (1961)); the pairings share rounds,
 * which the union bound allows. Another offset fits clearly better than the centre when the lower end
 * of its interval lies above the upper end of the centre's: then its |S| is larger, except with
 * probability at most α. |S| rather than S: a record whose outcomes are written with the other sign
 * correlates as strongly.
 */
export function decideAlignment(scan: OffsetScan, significance = ALIGNMENT_SIGNIFICANCE): AlignmentDecision {
  if (!(significance > 0 && significance < 1)) {
    throw new RangeError(`the significance of the alignment rule must lie between 0 and 1, not ${significance}`);
  }
  const delta = significance / scan.fits.length;
  const series = scan.fits.map((fit) => evidence(fit, delta));
  const atCentre = series.find((entry) => entry.offset === scan.centre) ?? series[0];
  const [best] = series.filter((entry) => entry !== atCentre).sort((one, other) => other.lower - one.lower || Math.abs(other.chshValue ?? 0) - Math.abs(one.chshValue ?? 0));
  return { centre: scan.centre, significance, series, atCentre, best, shifted: best.lower > atCentre.upper };
}

function evidence(fit: OffsetFit, delta: number): OffsetEvidence {
  const deviation = chshValueDeviation(fit.settingPairRounds, delta);
  const size = fit.chshValue === null ? null : Math.abs(fit.chshValue);
  return {
    offset: fit.offset,
    chshValue: fit.chshValue,
    deviation,
    lower: size === null ? 0 : Math.max(0, size - deviation),
    upper: size === null ? LARGEST_ABSOLUTE_S : Math.min(LARGEST_ABSOLUTE_S, size + deviation),
  };
}
