/** How a value between two whole units is settled. */
export type Rounding = 'down' | 'up' | 'nearest';

/** Digits kept below the unit before rounding: the binary noise of a typed decimal lies far below them. */
const GUARD_DIGITS = 3;

/**
 * A number of some unit as a whole number of a unit 10^`decimals` times smaller, rounded as asked:
 * 1300.5 m with 6 decimals is 1 300 500 000 µm. Read from the number's decimal expansion
 * (`toFixed`, exact for |value| < 10^21), so a value typed as a decimal keeps its digits instead of
 * picking up binary fractions; `down` and `up` are the floor and the ceiling. Throws a RangeError for
 * a value that is not finite or not below 10^21 in size.
 */
export function scaledInteger(value: number, decimals: number, rounding: Rounding): bigint {
  if (!Number.isFinite(value) || Math.abs(value) >= 1e21) {
    throw new RangeError(`${value} cannot be read as a decimal number`);
  }
  const text = value.toFixed(decimals + GUARD_DIGITS);
  const negative = text.startsWith('-');
  const fine = BigInt(text.replace('-', '').replace('.', '')) * (negative ? -1n : 1n);
  const guard = 10n ** BigInt(GUARD_DIGITS);
  const floor = floorDivide(fine, guard);
  const rest = fine - floor * guard;
  if (rest === 0n || rounding === 'down') return floor;
  if (rounding === 'up') return floor + 1n;
  return 2n * rest >= guard ? floor + 1n : floor;
}

/** ⌊n / d⌋ for d > 0 (bigint division truncates toward zero). */
export function floorDivide(n: bigint, d: bigint): bigint {
  const quotient = n / d;
  return quotient * d > n ? quotient - 1n : quotient;
}

/** ⌈n / d⌉ for d > 0. */
export function ceilingDivide(n: bigint, d: bigint): bigint {
  return -floorDivide(-n, d);
}
