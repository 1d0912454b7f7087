import { highPart, lowPart, timeOfParts } from './picosecond-parts';
import { StationBatch } from './station-batch';

/** The four times of a joined round, each in picoseconds since its own station's epoch. */
export interface RoundTimes {
  aSetting: bigint;
  aOutcome: bigint;
  bSetting: bigint;
  bOutcome: bigint;
}

/** One round both stations recorded, as a joined log's record holds it. */
export interface JoinedRound {
  /** Station A's round index (with a stated offset k, B recorded it as round + k). */
  round: number;
  x: number;
  y: number;
  a: number;
  b: number;
  /** Both stations' times, or null when either log has none. */
  times: RoundTimes | null;
}

/**
 * A batch of joined rounds, column by column (see `StationBatch`): station A's round index, x and a
 * from A's row, y and b from B's, and, when both logs have times, the four times as their exact
 * parts. The join refills the same batch: its rounds are valid until the next batch is asked for.
 */
export class JoinedBatch {
  length = 0;
  /** Whether both logs have times (set by the join before the first round goes in). */
  timed = false;
  readonly round: Float64Array;
  readonly x: Uint8Array;
  readonly y: Uint8Array;
  readonly a: Uint8Array;
  readonly b: Uint8Array;
  readonly aSettingHigh: Float64Array;
  readonly aSettingLow: Float64Array;
  readonly aOutcomeHigh: Float64Array;
  readonly aOutcomeLow: Float64Array;
  readonly bSettingHigh: Float64Array;
  readonly bSettingLow: Float64Array;
  readonly bOutcomeHigh: Float64Array;
  readonly bOutcomeLow: Float64Array;

  constructor(readonly capacity: number) {
    this.round = new Float64Array(capacity);
    [this.x, this.y, this.a, this.b] = [0, 1, 2, 3].map(() => new Uint8Array(capacity));
    [this.aSettingHigh, this.aSettingLow, this.aOutcomeHigh, this.aOutcomeLow, this.bSettingHigh, this.bSettingLow, this.bOutcomeHigh, this.bOutcomeLow] = Array.from(
      { length: 8 },
      () => new Float64Array(capacity),
    );
  }

  /** The rounds in a batch of their own, timed when all have times (for specs and stand-ins; a batch is timed throughout or not at all). */
  static of(rounds: readonly JoinedRound[]): JoinedBatch {
    const timed = rounds.filter((round) => round.times !== null).length;
    if (timed !== 0 && timed !== rounds.length) throw new RangeError('a batch of joined rounds has times for all of them or for none');
    const batch = new JoinedBatch(Math.max(rounds.length, 1));
    batch.timed = timed > 0;
    for (const [k, round] of rounds.entries()) {
      batch.round[k] = round.round;
      [batch.x[k], batch.y[k], batch.a[k], batch.b[k]] = [round.x, round.y, round.a, round.b];
      if (round.times !== null) {
        const { aSetting, aOutcome, bSetting, bOutcome } = round.times;
        [batch.aSettingHigh[k], batch.aSettingLow[k]] = [highPart(aSetting), lowPart(aSetting)];
        [batch.aOutcomeHigh[k], batch.aOutcomeLow[k]] = [highPart(aOutcome), lowPart(aOutcome)];
        [batch.bSettingHigh[k], batch.bSettingLow[k]] = [highPart(bSetting), lowPart(bSetting)];
        [batch.bOutcomeHigh[k], batch.bOutcomeLow[k]] = [highPart(bOutcome), lowPart(bOutcome)];
      }
    }
    batch.length = rounds.length;
    return batch;
  }

  get full(): boolean {
    return this.length === this.capacity;
  }

  /** Joins row `i` of A's batch with row `j` of B's (the times taken when `timed`). */
  add(rowsA: StationBatch, i: number, rowsB: StationBatch, j: number): void {
    const k = this.length++;
    this.round[k] = rowsA.round[i];
    this.x[k] = rowsA.setting[i];
    this.a[k] = rowsA.outcome[i];
    this.y[k] = rowsB.setting[j];
    this.b[k] = rowsB.outcome[j];
    if (this.timed) {
      this.aSettingHigh[k] = rowsA.settingTimeHigh![i];
      this.aSettingLow[k] = rowsA.settingTimeLow![i];
      this.aOutcomeHigh[k] = rowsA.outcomeTimeHigh![i];
      this.aOutcomeLow[k] = rowsA.outcomeTimeLow![i];
      this.bSettingHigh[k] = rowsB.settingTimeHigh![j];
      this.bSettingLow[k] = rowsB.settingTimeLow![j];
      this.bOutcomeHigh[k] = rowsB.outcomeTimeHigh![j];
      this.bOutcomeLow[k] = rowsB.outcomeTimeLow![j];
    }
  }

  /** Round `k`'s times, exact (for the rare margin beyond the fast arithmetic, and for specs). */
  times(k: number): RoundTimes | null {
    if (!this.timed) return null;
    return {
      aSetting: timeOfParts(this.aSettingHigh[k], this.aSettingLow[k]),
      aOutcome: timeOfParts(this.aOutcomeHigh[k], this.aOutcomeLow[k]),
      bSetting: timeOfParts(this.bSettingHigh[k], this.bSettingLow[k]),
      bOutcome: timeOfParts(this.bOutcomeHigh[k], this.bOutcomeLow[k]),
    };
  }

  /** Every round as an object (for specs). */
  rounds(): JoinedRound[] {
    return Array.from({ length: this.length }, (_, k) => ({ round: this.round[k], x: this.x[k], y: this.y[k], a: this.a[k], b: this.b[k], times: this.times(k) }));
  }
}
