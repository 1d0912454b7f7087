/**
 * The latest time a station log may write, 2^63 − 1 ps (about 106 days after the station's epoch):
 * the largest signed 64-bit integer, what a time tagger's counter or a lab's own tools hold.
 */
export const LATEST_PICOSECOND_TIME = 2n ** 63n - 1n;

const DIGITS = /^[0-9]{1,19}$/;

/**
 * Reads a time field of a station log: whole picoseconds since the station's own epoch, written as
 * ASCII digits only (no sign, no decimal point, no exponent), 0 … 2^63 − 1. Kept as a bigint, so
 * every time of a long night is exact (a double holds whole picoseconds only up to 2^53 ps, about
 * 2.5 hours). Returns null for anything else.
 */
export function parsePicosecondTime(text: string): bigint | null {
  if (!DIGITS.test(text)) {
    return null;
  }
  const value = BigInt(text);
  return value <= LATEST_PICOSECOND_TIME ? value : null;
}
