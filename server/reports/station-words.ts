import { marginText, shareText, signedRounds, STATION_COLUMNS, type StationJoinSummary, type StationPairSummary, type TimingSummary } from '@shared/analysis';
import { otherStation, type RunStationsDto, type StationName } from '@shared/api';
import { formatCount } from '@shared/format/numbers';

// The words of a run of two station logs, written once for the PDF and the mails.

/** The caution under the timing figures: they stand on the lab's word for the geometry. */
export const TIMING_CAUTION =
  'The timing figures are estimates: they rest on the distance between the stations and the clock comparison the lab stated for the setup, ' +
  'which Bellkeep cannot check. A wrong distance or clock offset moves every margin.';

/** The two logs by name: "station A's north-hall.csv and station B's mill-lane.csv.gz". */
export function stationFilesText(stationAName: string, stationBName: string): string {
  return `station A's ${stationAName} and station B's ${stationBName}`;
}

/**
 * The offset the records were paired at on a shift lead's word, with the reason and the run this
 * one re-runs: "Paired at offset −4, station A's round r with station B's round r − 4: the counter
 * started late. A re-run of run 417." Null when the records were joined as written. The offset
 * applied is the result's own (the join records it); the run re-run is the API's.
 */
export function statedOffsetSentence(pair: StationPairSummary | undefined, stations: RunStationsDto | null | undefined): string | null {
  const fromRun = stations && stations.offset !== null ? { rounds: stations.offset, reason: stations.offsetReason ?? '' } : null;
  const applied = pair?.join?.statedOffset ?? fromRun;
  if (applied === null) return null;
  const shift = applied.rounds === 0 ? '' : ` ${applied.rounds > 0 ? '+' : '−'} ${formatCount(Math.abs(applied.rounds))}`;
  const reason = applied.reason.trim() === '' ? 'no reason recorded.' : withStop(applied.reason.trim());
  const rerun = stations?.realignedFrom == null ? '' : ` A re-run of run ${stations.realignedFrom}.`;
  return `Paired at offset ${signedRounds(applied.rounds)}, station A's round r with station B's round r${shift}: ${reason}${rerun}`;
}

/**
 * What one station's record lacks within the span of both, numbered as station A numbers rounds:
 * the rounds only the other station recorded (the first listed) and the record's longest gap.
 * "3 rounds station B recorded (the first: 12 000, 12 001, 12 002). Its longest gap: 3 rounds from round 12 000."
 */
export function lackingSentence(station: StationName, gaps: StationJoinSummary['stationA']): string {
  const other = otherStation(station);
  const { lacking, firstLacking, longestGap } = gaps;
  const listed = firstLacking.map(formatCount).join(', ') + (lacking > firstLacking.length ? ', …' : '');
  const lacks =
    lacking === 0
      ? `None of the rounds station ${other} recorded.`
      : `${formatCount(lacking)} ${lacking === 1 ? 'round' : 'rounds'} station ${other} recorded (${lacking === 1 ? 'round' : 'the first'}: ${listed}).`;
  const gap =
    longestGap === null
      ? ''
      : ` Its longest gap: ${formatCount(longestGap.rounds)} ${longestGap.rounds === 1 ? 'round' : 'rounds'} from round ${formatCount(longestGap.firstRound)}.`;
  return lacks + gap;
}

/** The smallest margin with where it fell: "2 732.885 ns (round 5 202, at station B's outcome)". */
export function smallestMarginText(timing: TimingSummary): string {
  const smallest = timing.smallestMargin;
  if (smallest === null) return "none: no joined round has both stations' times";
  return `${marginText(smallest.picoseconds)} (round ${formatCount(smallest.round)}, at station ${smallest.station}'s outcome)`;
}

/** The rounds without space-like separation among the timed ones: "205 of 20 000 timed rounds (1.0 %)". */
export function notSpaceLikeText(timing: TimingSummary): string {
  return `${formatCount(timing.notSpaceLike)} of ${formatCount(timing.timedRounds)} timed rounds (${shareText(timing.notSpaceLike, timing.timedRounds)})`;
}

/** The timing check's figures in one sentence, for a mail. */
export function timingSentence(timing: TimingSummary): string {
  return `Timing check: smallest margin ${smallestMarginText(timing)}; ${notSpaceLikeText(timing)} without space-like separation.`;
}

/** What a shift lead can do about a shift the alignment check found: the records are never realigned by Bellkeep. */
export const SHIFT_REMEDY = 'Nothing was realigned: a shift lead may re-run the night at a stated offset, with the reason for it.';

/** Station B's clock against station A's as the check used it: "−123 456.789 ns ± 1.500 ns". */
export function clockOffsetText(timing: TimingSummary): string {
  return `${marginText(timing.clockOffsetPs)} ± ${marginText(timing.clockUncertaintyPs)}`;
}

/**
 * Why a pair's timing was not checked: a log that could not be read, no distance or clock offset
 * in the setup when the run was made, or a log without time columns. With the run's record of the
 * geometry at hand it is read from there; without it (an older report) the missing geometry is
 * inferred, since the engine checks the timing whenever both logs have times and the geometry was given.
 */
export function timingNotCheckedSentence(pair: StationPairSummary, stations: RunStationsDto | null | undefined): string {
  if (pair.files.some((file) => file.problemCount > 0)) return 'The timing was not checked: a station log could not be read.';
  const untimed = pair.files.filter((file) => !file.hasTimes).map((file) => file.station);
  const noGeometry = stations ? stations.geometry === null : untimed.length === 0;
  const columns = `${STATION_COLUMNS.A.settingTime}, ${STATION_COLUMNS.A.outcomeTime}`;
  const why = [
    ...(noGeometry ? ['the setup had no distance between the stations or no clock offset when the run was made'] : []),
    ...(untimed.length === 2 ? [`neither station's log has the time columns (${columns})`] : []),
    ...(untimed.length === 1 ? [`station ${untimed[0]}'s log has no time columns (${columns})`] : []),
  ];
  return why.length === 0 ? 'The timing was not checked: this result holds no timing figures.' : `The timing was not checked: ${why.join(', and ')}.`;
}

/** The distance between the stations to the micrometre, as the timing check reads it: 1300.5 → "1 300.5 m". */
export function distanceText(stationDistanceM: number): string {
  const [whole, fraction = ''] = stationDistanceM.toFixed(6).replace(/0+$/, '').split('.');
  return `${formatCount(Number(whole))}${fraction === '' ? '' : `.${fraction}`}\u2009m`;
}

/** A sentence as the user wrote it, ending in a full stop unless it ends in its own. */
function withStop(text: string): string {
  return /[.!?]$/.test(text) ? text : `${text}.`;
}
