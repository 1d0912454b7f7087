import { JoinedRound } from './joined-round';
import { MARGIN_BIN_COUNT, MarginBin, marginBin, marginBins } from './margin-histogram';
import { Station } from './station-columns';
import { StationGeometry, TimingFrame, timingFrame } from './station-geometry';
import { roundMargins } from './timing-margins';

/** How many rounds without space-like separation are listed by round index. */
export const LISTED_NOT_SPACE_LIKE = 10;

/** The smallest margin of the rounds checked. */
export interface SmallestMargin {
  /** The round (station A's index). */
  round: number;
  /** Whose outcome it is at. */
  station: Station;
  /** The margin, picoseconds (exact up to 2^53 ps in size, about 2.5 hours; rounded beyond). */
  picoseconds: number;
}

/** What the timing check found. */
export interface TimingSummary {
  /** The geometry as used, whole picoseconds (see `TimingFrame` for the roundings). */
  lightTimePs: number;
  clockOffsetPs: number;
  clockUncertaintyPs: number;
  /** Joined rounds with both stations' times, and those without. */
  timedRounds: number;
  untimedRounds: number;
  /** Timed rounds with a margin ≤ 0 at either station's outcome. */
  notSpaceLike: number;
  /** notSpaceLike / timedRounds; null without timed rounds. */
  notSpaceLikeShare: number | null;
  /** The first of them, at most `LISTED_NOT_SPACE_LIKE`. */
  firstNotSpaceLike: number[];
  /** The smallest margin, or null without timed rounds. */
  smallestMargin: SmallestMargin | null;
  /** Each timed round's smaller margin, in fixed bins of tenths of the light time. */
  histogram: MarginBin[];
}

/**
 * The locality check of a joined stream: for each round, the margin of each station's outcome
 * against the other's setting choice (`roundMargins`); its smaller margin decides the round and goes
 * to the histogram. Fed a batch at a time; holds nothing per round.
 */
export class TimingCheck {
  private readonly frame: TimingFrame;
  private readonly counts = new Float64Array(MARGIN_BIN_COUNT);
  private timed = 0;
  private untimed = 0;
  private notSpaceLike = 0;
  private readonly firstNotSpaceLike: number[] = [];
  private smallest: { round: number; station: Station; margin: bigint } | null = null;

  constructor(geometry: StationGeometry) {
    this.frame = timingFrame(geometry);
  }

  /** Checks a batch of joined rounds. */
  add(rounds: readonly JoinedRound[]): void {
    const lightTime = this.frame.lightTimePs;
    for (const round of rounds) {
      if (round.times === null) {
        this.untimed++;
        continue;
      }
      const { atA, atB } = roundMargins(round.times, this.frame);
      const station: Station = atA <= atB ? 'A' : 'B';
      const margin = station === 'A' ? atA : atB;
      this.timed++;
      this.counts[marginBin(margin, lightTime)]++;
      if (margin <= 0n) {
        this.notSpaceLike++;
        if (this.firstNotSpaceLike.length < LISTED_NOT_SPACE_LIKE) this.firstNotSpaceLike.push(round.round);
      }
      if (this.smallest === null || margin < this.smallest.margin) {
        this.smallest = { round: round.round, station, margin };
      }
    }
  }

  /** What the check found so far. */
  summary(): TimingSummary {
    const smallest = this.smallest;
    return {
      lightTimePs: Number(this.frame.lightTimePs),
      clockOffsetPs: Number(this.frame.clockOffsetPs),
      clockUncertaintyPs: Number(this.frame.clockUncertaintyPs),
      timedRounds: this.timed,
      untimedRounds: this.untimed,
      notSpaceLike: this.notSpaceLike,
      notSpaceLikeShare: this.timed === 0 ? null : this.notSpaceLike / this.timed,
      firstNotSpaceLike: [...this.firstNotSpaceLike],
      smallestMargin: smallest === null ? null : { round: smallest.round, station: smallest.station, picoseconds: Number(smallest.margin) },
      histogram: marginBins(this.counts),
    };
  }
}
