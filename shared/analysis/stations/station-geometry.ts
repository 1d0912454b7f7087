import { scaledInteger } from './decimal-units';
import { lightTime } from './light-time';

/**
 * Where the stations are, as a setup records it (the same names and units as the setup's own
 * fields): the straight-line distance between them, and station B's clock minus station A's at
 * the same instant with the uncertainty of that comparison.
 */
export interface StationGeometry {
  /** Metres, above 0 and at most 10^9. */
  stationDistanceM: number;
  /** Station B's clock minus station A's at the same instant, nanoseconds, within ±10^12. */
  clockOffsetNs: number;
  /** How well the clocks were compared, nanoseconds, 0 … 10^12. */
  clockUncertaintyNs: number;
}

/** The geometry in whole picoseconds, each rounded against the lab where a direction exists. */
export interface TimingFrame {
  /** d/c rounded down: light is taken to arrive no later than it does. */
  lightTimePs: bigint;
  /** B's clock minus A's, to the nearest picosecond (a signed quantity: no side is safe). */
  clockOffsetPs: bigint;
  /** The offset's uncertainty rounded up. */
  clockUncertaintyPs: bigint;
}

/** The largest distance and clock figures accepted, as a setup accepts them. */
const LARGEST_DISTANCE_M = 1e9;
const LARGEST_CLOCK_NS = 1e12;

/**
 * The geometry as whole picoseconds. Throws a RangeError naming the field for a value out of range.
 * Within these ranges every figure is below 4·10^15 ps, a safe integer.
 */
export function timingFrame(geometry: StationGeometry): TimingFrame {
  const { stationDistanceM, clockOffsetNs, clockUncertaintyNs } = geometry;
  if (!(stationDistanceM > 0 && stationDistanceM <= LARGEST_DISTANCE_M)) {
    throw new RangeError(`stationDistanceM must be above 0 and at most 10⁹ m, not ${stationDistanceM}`);
  }
  if (!(Math.abs(clockOffsetNs) <= LARGEST_CLOCK_NS)) {
    throw new RangeError(`clockOffsetNs must be within ±10¹² ns, not ${clockOffsetNs}`);
  }
  if (!(clockUncertaintyNs >= 0 && clockUncertaintyNs <= LARGEST_CLOCK_NS)) {
    throw new RangeError(`clockUncertaintyNs must be 0 … 10¹² ns, not ${clockUncertaintyNs}`);
  }
  return {
    lightTimePs: lightTime(stationDistanceM).whole,
    clockOffsetPs: scaledInteger(clockOffsetNs, 3, 'nearest'),
    clockUncertaintyPs: scaledInteger(clockUncertaintyNs, 3, 'up'),
  };
}
