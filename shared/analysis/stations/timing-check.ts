import { JoinedBatch } from './joined-round';
import { MARGIN_BIN_COUNT, MarginBin, marginBin, marginBinOfSafe, marginBins } from './margin-histogram';
import { PART_SCALE } from './picosecond-parts';
import { Station } from './station-columns';
import { StationGeometry, TimingFrame, timingFrame } from './station-geometry';
import { RoundMargins, roundMargins } from './timing-margins';

/**
 * The largest difference of two times' high parts the margin arithmetic in doubles takes: with it
 * and the frame's figures (each below 2.01·10^15 ps once combined), every partial sum of a margin is
 * an integer below 6.3·10^15 < 2^53, so exact. Larger differences (clocks hours apart) take bigints.
 */
const SAFE_HIGH_DIFFERENCE = 2 ** 22;

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
  /** The frame's constant terms of each margin in doubles (see `roundMargins`): d/c − o − u at A, d/c + o − u at B. */
  private readonly constantAtA: number;
  private readonly constantAtB: number;
  private readonly lightTime: number;
  /** Whether the frame's figures allow the arithmetic in doubles at all. */
  private readonly safeFrame: boolean;
  private readonly counts = new Float64Array(MARGIN_BIN_COUNT);
  private timed = 0;
  private untimed = 0;
  private notSpaceLike = 0;
  private readonly firstNotSpaceLike: number[] = [];
  private smallest: { round: number; station: Station; margin: bigint } | null = null;
  /** The smallest margin as a double (exact when within 2^53; beyond, it still orders against any safe margin correctly). */
  private smallestAsNumber = Infinity;

  constructor(geometry: StationGeometry) {
    this.frame = timingFrame(geometry);
    const { lightTimePs, clockOffsetPs, clockUncertaintyPs } = this.frame;
    this.constantAtA = Number(lightTimePs - clockOffsetPs - clockUncertaintyPs);
    this.constantAtB = Number(lightTimePs + clockOffsetPs - clockUncertaintyPs);
    this.lightTime = Number(lightTimePs);
    this.safeFrame = this.lightTime > 0 && [this.constantAtA, this.constantAtB].every((value) => Math.abs(value) <= 2.01e15);
  }

  /** Checks a batch of joined rounds. */
  add(rounds: JoinedBatch): void {
    if (!rounds.timed) {
      this.untimed += rounds.length;
      return;
    }
    for (let k = 0; k < rounds.length; k++) {
      const highAtA = rounds.bSettingHigh[k] - rounds.aOutcomeHigh[k];
      const highAtB = rounds.aSettingHigh[k] - rounds.bOutcomeHigh[k];
      if (this.safeFrame && Math.abs(highAtA) <= SAFE_HIGH_DIFFERENCE && Math.abs(highAtB) <= SAFE_HIGH_DIFFERENCE) {
        const atA = highAtA * PART_SCALE + (rounds.bSettingLow[k] - rounds.aOutcomeLow[k]) + this.constantAtA;
        const atB = highAtB * PART_SCALE + (rounds.aSettingLow[k] - rounds.bOutcomeLow[k]) + this.constantAtB;
        this.addSafeMargins(rounds.round[k], atA, atB);
      } else {
        this.addMargins(rounds.round[k], roundMargins(rounds.times(k)!, this.frame));
      }
    }
  }

  /** One round's margins as safe integers in doubles: the same counts as `addMargins` would make of them. */
  private addSafeMargins(round: number, atA: number, atB: number): void {
    const station: Station = atA <= atB ? 'A' : 'B';
    const margin = station === 'A' ? atA : atB;
    this.timed++;
    this.counts[marginBinOfSafe(margin, this.lightTime)]++;
    if (margin <= 0) this.noteNotSpaceLike(round);
    if (this.smallest === null || margin < this.smallestAsNumber) {
      this.smallest = { round, station, margin: BigInt(margin) };
      this.smallestAsNumber = margin;
    }
  }

  /** One round's margins, exact at any size. */
  private addMargins(round: number, { atA, atB }: RoundMargins): void {
    const station: Station = atA <= atB ? 'A' : 'B';
    const margin = station === 'A' ? atA : atB;
    this.timed++;
    this.counts[marginBin(margin, this.frame.lightTimePs)]++;
    if (margin <= 0n) this.noteNotSpaceLike(round);
    if (this.smallest === null || margin < this.smallest.margin) {
      this.smallest = { round, station, margin };
      this.smallestAsNumber = Number(margin);
    }
  }

  private noteNotSpaceLike(round: number): void {
    this.notSpaceLike++;
    if (this.firstNotSpaceLike.length < LISTED_NOT_SPACE_LIKE) this.firstNotSpaceLike.push(round);
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
