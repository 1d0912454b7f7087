import { ceilingDivide } from './decimal-units';

/** Bins per light time: the histogram's bins are a tenth of d/c wide. */
export const BINS_PER_LIGHT_TIME = 10;

/**
 * The fixed bins of the margin histogram, in tenths of the light time d/c: (−∞, −1], (−1, −0.9], …,
 * (0.9, 1], (1, ∞). Each bin is open below and closed above, so the bins up to (−0.1, 0] hold exactly
 * the rounds without space-like separation (margin ≤ 0). 22 bins.
 */
export const MARGIN_BIN_COUNT = 2 * BINS_PER_LIGHT_TIME + 2;

/** One bin of the histogram. */
export interface MarginBin {
  /** Lower edge (excluded) as a fraction of the light time; null for −∞. */
  above: number | null;
  /** Upper edge (included) as a fraction of the light time; null for +∞. */
  upTo: number | null;
  /** Rounds whose margin falls in it. */
  rounds: number;
}

/**
 * The bin of a margin, by exact integer arithmetic: k = ⌈10·margin / light time⌉ is the upper edge
 * in tenths, clamped to the two open-ended bins.
 */
export function marginBin(marginPs: bigint, lightTimePs: bigint): number {
  const tenths = ceilingDivide(BigInt(BINS_PER_LIGHT_TIME) * marginPs, lightTimePs);
  const limit = BigInt(BINS_PER_LIGHT_TIME);
  if (tenths <= -limit) return 0;
  if (tenths > limit) return MARGIN_BIN_COUNT - 1;
  return Number(tenths) + BINS_PER_LIGHT_TIME;
}

/**
 * `marginBin` in doubles, for a margin and light time that are safe integers with the light time
 * above 0 (the timing check's common case): the end bins by comparison, otherwise k = ⌈10·margin /
 * light time⌉ with the quotient's rounding corrected by exact products (|10·margin| ≤ 10·light time
 * < 2^53 there).
 */
export function marginBinOfSafe(marginPs: number, lightTimePs: number): number {
  if (marginPs <= -lightTimePs) return 0;
  if (marginPs > lightTimePs) return MARGIN_BIN_COUNT - 1;
  const scaled = BINS_PER_LIGHT_TIME * marginPs;
  let tenths = Math.ceil(scaled / lightTimePs);
  while ((tenths - 1) * lightTimePs >= scaled) tenths--;
  while (tenths * lightTimePs < scaled) tenths++;
  return tenths + BINS_PER_LIGHT_TIME;
}

/** The bins with their counts (`counts` indexed as `marginBin` numbers them). */
export function marginBins(counts: ArrayLike<number>): MarginBin[] {
  return Array.from({ length: MARGIN_BIN_COUNT }, (_, bin) => ({
    above: bin === 0 ? null : (bin - BINS_PER_LIGHT_TIME - 1) / BINS_PER_LIGHT_TIME,
    upTo: bin === MARGIN_BIN_COUNT - 1 ? null : (bin - BINS_PER_LIGHT_TIME) / BINS_PER_LIGHT_TIME,
    rounds: counts[bin],
  }));
}
