/**
 * A picosecond time held as two doubles, t = high·10^9 + low with 0 ≤ low < 10^9: every time up to
 * 2^63 − 1 ps stays exact (high < 2^34), and the batches of a station log hold its times in typed
 * arrays instead of a bigint per field.
 */
export const PART_SCALE = 1_000_000_000;
const PART_SCALE_BIG = BigInt(PART_SCALE);

/** The high part of a time (picoseconds ≥ 0). */
export function highPart(time: bigint): number {
  return Number(time / PART_SCALE_BIG);
}

/** The low part of a time (picoseconds ≥ 0). */
export function lowPart(time: bigint): number {
  return Number(time % PART_SCALE_BIG);
}

/** The time its two parts stand for. */
export function timeOfParts(high: number, low: number): bigint {
  return BigInt(high) * PART_SCALE_BIG + BigInt(low);
}
