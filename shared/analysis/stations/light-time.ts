import { floorDivide, scaledInteger } from './decimal-units';

/**
 * The speed of light in vacuum, exactly 299 792 458 m/s: a defining constant of the SI, which fixes
 * the metre by it (BIPM, The International System of Units, 9th ed. (2019), from memory).
 */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458n;

/** Picoseconds per second. */
const PICOSECONDS_PER_SECOND = 10n ** 12n;

/** Micrometres per metre. */
const MICROMETRES_PER_METRE = 10n ** 6n;

/** The time light takes over a distance, in picoseconds, exactly: whole + remainder / divisor. */
export interface LightTime {
  /** The whole picoseconds, rounded down. */
  whole: bigint;
  /** What is left, in units of 1/divisor ps (0 ≤ remainder < divisor). */
  remainder: bigint;
  /** The divisor of the remainder: c in m/s. */
  divisor: bigint;
}

/**
 * The travel time of light over `distanceM` metres in vacuum, d/c, in picoseconds. The distance is
 * taken in whole micrometres, rounded down (a shorter distance, an earlier arrival: never in the
 * lab's favour), so d/c = µm · 10^6 / 299 792 458 ps exactly, kept as whole picoseconds and a
 * remainder. A signal in fibre is slower; the locality check uses c, the bound no signal beats.
 *
 * @example lightTime(1000) → { whole: 3335640n, remainder: 285396880n, divisor: 299792458n } (3 335 640.951 98… ps)
 */
export function lightTime(distanceM: number): LightTime {
  if (!(distanceM > 0)) {
    throw new RangeError(`the distance between the stations must be above 0 m, not ${distanceM}`);
  }
  const micrometres = scaledInteger(distanceM, 6, 'down');
  const numerator = (micrometres * PICOSECONDS_PER_SECOND) / MICROMETRES_PER_METRE;
  const whole = floorDivide(numerator, SPEED_OF_LIGHT_M_PER_S);
  return { whole, remainder: numerator - whole * SPEED_OF_LIGHT_M_PER_S, divisor: SPEED_OF_LIGHT_M_PER_S };
}
