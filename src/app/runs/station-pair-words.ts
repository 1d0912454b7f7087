import { marginText, shareText, signedRounds, STATION_COLUMNS, type StationFileSummary, type StationJoinSummary, type TimingSummary } from '@shared/analysis';
import type { RunStationsDto, StationName } from '@shared/api';
import { formatCount } from '@shared/format/numbers';

/** What one station's record lacks, as the join counted it. */
type RecordGaps = StationJoinSummary['stationA'];

/** "3 rounds", "1 round". */
function rounds(count: number): string {
  return `${formatCount(count)} ${count === 1 ? 'round' : 'rounds'}`;
}

/** A list of round indices, with "…" when there are more than listed: "1 203, 1 204, …". */
function roundList(listed: readonly number[], total: number): string {
  return listed.map(formatCount).join(', ') + (total > listed.length ? ', …' : '');
}

/**
 * What one station's record lacks, in a sentence: the rounds only the other station recorded (the
 * first listed) and the record's longest gap, its two ends included.
 */
export function lackingSentence(station: StationName, gaps: RecordGaps): string {
  const other = station === 'A' ? 'B' : 'A';
  const lacking =
    gaps.lacking === 0
      ? `Station ${station}’s log lacks no round that station ${other} recorded.`
      : `Station ${station}’s log lacks ${rounds(gaps.lacking)} that station ${other} recorded (${roundList(gaps.firstLacking, gaps.lacking)}).`;
  const gap = gaps.longestGap;
  if (gap === null) return lacking;
  const last = gap.firstRound + gap.rounds - 1;
  const where = gap.rounds === 1 ? `round ${formatCount(gap.firstRound)}` : `rounds ${formatCount(gap.firstRound)} to ${formatCount(last)}`;
  return `${lacking} Its longest gap: ${where} (${rounds(gap.rounds)}).`;
}

/** The join in a sentence: joined rounds among the span's triggers, and the missing ones. */
export function joinSentence(join: StationJoinSummary): string {
  if (join.span === null) return 'Neither log holds a readable round: nothing was joined.';
  const { firstRound, lastRound, triggers } = join.span;
  const neither = join.missingFromBoth > 0 ? `, ${formatCount(join.missingFromBoth)} of them in neither log` : '';
  return (
    `${rounds(join.joinedRounds)} joined of the ${formatCount(triggers)} round indices from ${formatCount(firstRound)} to ${formatCount(lastRound)} ` +
    `that either log holds; ${formatCount(join.missing)} missing${neither}. A round only one station recorded is missing, never left out.`
  );
}

/** The stated offset in words: "+3: station A’s round r is paired with station B’s round r + 3". */
export function statedOffsetWords(offset: number): string {
  const pairing = offset === 0 ? 'station B’s round r' : `station B’s round r ${offset > 0 ? '+' : '−'} ${formatCount(Math.abs(offset))}`;
  return `${signedRounds(offset)}: station A’s round r is paired with ${pairing}`;
}

/**
 * Why the timing of a pair was not checked: the setup lacked its distance or clock offset when the
 * run was made, or a log has no time columns (each named). Empty when nothing of that is missing.
 */
export function timingNotCheckedSentence(stations: RunStationsDto, files: readonly StationFileSummary[]): string {
  const reasons: string[] = [];
  if (stations.geometry === null) {
    reasons.push('the setup had no distance between its stations, or no clock offset of station B with its uncertainty, when the run was made');
  }
  const untimed = files.filter((file) => !file.hasTimes).map((file) => file.station);
  const columns = `${STATION_COLUMNS.A.settingTime}, ${STATION_COLUMNS.A.outcomeTime}`;
  if (untimed.length === 2) reasons.push(`neither log has the time columns (${columns})`);
  else if (untimed.length === 1) reasons.push(`station ${untimed[0]}’s log has no time columns (${columns})`);
  return reasons.length === 0 ? '' : `The timing was not checked: ${reasons.join(', and ')}.`;
}

/** The timing check's figures, each in words and the page's numbers. */
export interface TimingFigures {
  readonly lightTime: string;
  readonly clockOffset: string;
  readonly timedRounds: string;
  readonly smallestMargin: string;
  readonly notSpaceLike: string;
  /** Whether every timed round is space-like separated (and some were timed). */
  readonly allSpaceLike: boolean;
}

/** The timing check's figures: margins in ns to the picosecond, counts with their share. */
export function timingFigures(timing: TimingSummary): TimingFigures {
  const { smallestMargin, timedRounds, untimedRounds, notSpaceLike } = timing;
  const untimed = untimedRounds > 0 ? ` (${formatCount(untimedRounds)} joined rounds without both stations’ times)` : '';
  const first = timing.firstNotSpaceLike.length > 0 ? `; the first: ${roundList(timing.firstNotSpaceLike, notSpaceLike)}` : '';
  return {
    lightTime: marginText(timing.lightTimePs),
    clockOffset: `${marginText(timing.clockOffsetPs)} ± ${marginText(timing.clockUncertaintyPs)}`,
    timedRounds: formatCount(timedRounds) + untimed,
    smallestMargin:
      smallestMargin === null ? '–' : `${marginText(smallestMargin.picoseconds)} (round ${formatCount(smallestMargin.round)}, at station ${smallestMargin.station}’s outcome)`,
    notSpaceLike: `${formatCount(notSpaceLike)} of ${formatCount(timedRounds)} (${shareText(notSpaceLike, timedRounds)})${first}`,
    allSpaceLike: timedRounds > 0 && notSpaceLike === 0,
  };
}
