import { formatCount } from '../../format/numbers';
import { CheckFinding } from '../checks/check-result';
import { AnalysisProfile } from '../profile';
import { shareText } from '../report/missing-rounds';
import { Station, STATION_COLUMNS } from './station-columns';
import { TimingSummary } from './timing-check';

/** The id of the timing check among a result's checks. */
export const SPACE_LIKE_CHECK_ID = 'space-like-separation';

/** What a pair of station logs lacks for its timing to be checked. */
export interface TimingGaps {
  /** Whether the stations' distance and clock offset were given. */
  geometry: boolean;
  /** The stations whose log has no time columns. */
  untimedStations: readonly Station[];
}

const REQUIRED = 'The profile requires space-like separation';
const TIME_COLUMNS = `${STATION_COLUMNS.A.settingTime}, ${STATION_COLUMNS.A.outcomeTime}`;

/**
 * Why one joined log cannot be judged under a profile that requires space-like separation, or null
 * when the profile only reports the timing: a joined log has neither station's times nor the
 * distance between the stations.
 */
export function joinedLogTimingRefusal(profile: AnalysisProfile): string | null {
  if (profile.spaceLikeSeparation !== 'required') return null;
  return `${REQUIRED}, which only two station logs with their time columns (${TIME_COLUMNS}) and the setup's distance between the stations can show: one joined log cannot be judged under it.`;
}

/**
 * Why a pair of station logs cannot be judged under a profile that requires space-like separation:
 * the sentence names exactly what is missing. Null when nothing is, or when the profile only reports
 * the timing.
 */
export function pairTimingRefusal(profile: AnalysisProfile, gaps: TimingGaps): string | null {
  if (profile.spaceLikeSeparation !== 'required') return null;
  const missing: string[] = [];
  if (!gaps.geometry) missing.push("no distance between the stations with station B's clock offset and its uncertainty was given");
  if (gaps.untimedStations.length === 2) missing.push(`neither station's log has the time columns (${TIME_COLUMNS})`);
  else if (gaps.untimedStations.length === 1) missing.push(`station ${gaps.untimedStations[0]}'s log has no time columns (${TIME_COLUMNS})`);
  if (missing.length === 0) return null;
  return `${REQUIRED}, but the timing of these station logs cannot be checked: ${missing.join(', and ')}.`;
}

/**
 * The timing check as one of the run's checks: it holds when every timed round is space-like
 * separated (both margins above 0, see `roundMargins`). Its failure blocks ACCEPT when the profile
 * requires space-like separation, and only warns when the profile reports it. Counts, not a test:
 * no p-value.
 */
export function spaceLikeFinding(timing: TimingSummary, profile: AnalysisProfile): CheckFinding {
  const { timedRounds, notSpaceLike, smallestMargin } = timing;
  const holds = timedRounds > 0 && notSpaceLike === 0;
  const smallest =
    smallestMargin === null
      ? ''
      : `${marginText(smallestMargin.picoseconds)} (round ${formatCount(smallestMargin.round)}, at station ${smallestMargin.station}'s outcome; light takes ${marginText(timing.lightTimePs)} between the stations)`;
  const reported = holds || profile.spaceLikeSeparation === 'required' ? '' : ' The profile reports the timing without judging it.';
  let message: string;
  if (timedRounds === 0) {
    message = "No joined round has both stations' times, so no round shows space-like separation.";
  } else if (holds) {
    message = `All ${formatCount(timedRounds)} timed rounds are space-like separated: the smallest margin is ${smallest}.`;
  } else {
    message =
      `${formatCount(notSpaceLike)} of the ${formatCount(timedRounds)} timed rounds (${shareText(notSpaceLike, timedRounds)}) lack space-like separation: ` +
      `a station recorded its outcome before light from the other station's setting choice could have reached it. The smallest margin is ${smallest}.`;
  }
  return {
    id: SPACE_LIKE_CHECK_ID,
    family: null,
    holds,
    alwaysBlocks: profile.spaceLikeSeparation === 'required',
    observed: notSpaceLike,
    threshold: 0,
    message: message + reported,
  };
}

/** A margin of picoseconds in nanoseconds, exact to the picosecond: −2 265 167 ps → "−2 265.167 ns". */
export function marginText(picoseconds: number): string {
  const size = Math.abs(picoseconds);
  const sign = picoseconds < 0 ? '−' : '';
  return `${sign}${formatCount(Math.floor(size / 1000))}.${String(size % 1000).padStart(3, '0')}\u2009ns`;
}
