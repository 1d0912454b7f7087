import { highPart, lowPart, timeOfParts } from './picosecond-parts';
import { StationRow } from './station-row';

/** The typed arrays of a batch. */
export interface StationColumns {
  round: Float64Array;
  setting: Uint8Array;
  outcome: Uint8Array;
  settingTimeHigh: Float64Array | null;
  settingTimeLow: Float64Array | null;
  outcomeTimeHigh: Float64Array | null;
  outcomeTimeLow: Float64Array | null;
}

function emptyColumns(capacity: number, timed: boolean): StationColumns {
  const times = () => (timed ? new Float64Array(capacity) : null);
  return {
    round: new Float64Array(capacity),
    setting: new Uint8Array(capacity),
    outcome: new Uint8Array(capacity),
    settingTimeHigh: times(),
    settingTimeLow: times(),
    outcomeTimeHigh: times(),
    outcomeTimeLow: times(),
  };
}

/**
 * A batch of one station log's valid rows, column by column in typed arrays (no object per row):
 * the form in which the reader hands rows to the join and the alignment scan. Times, when the log
 * has them, are held as their two exact parts (`picosecond-parts`). A reader refills the same batch,
 * so its rows are valid until the next batch is asked for.
 */
export class StationBatch {
  /** Rows held, from index 0. */
  length = 0;
  readonly round: Float64Array;
  readonly setting: Uint8Array;
  readonly outcome: Uint8Array;
  /** The times' parts, or null when the log has no times. */
  readonly settingTimeHigh: Float64Array | null;
  readonly settingTimeLow: Float64Array | null;
  readonly outcomeTimeHigh: Float64Array | null;
  readonly outcomeTimeLow: Float64Array | null;

  constructor(
    readonly capacity: number,
    readonly timed: boolean,
    columns: StationColumns = emptyColumns(capacity, timed),
  ) {
    ({
      round: this.round,
      setting: this.setting,
      outcome: this.outcome,
      settingTimeHigh: this.settingTimeHigh,
      settingTimeLow: this.settingTimeLow,
      outcomeTimeHigh: this.outcomeTimeHigh,
      outcomeTimeLow: this.outcomeTimeLow,
    } = columns);
  }

  /** A batch of the first `length` rows of columns made elsewhere (another thread's), without copying them. */
  static ofColumns(length: number, columns: StationColumns): StationBatch {
    const batch = new StationBatch(columns.round.length, columns.settingTimeHigh !== null, columns);
    batch.length = length;
    return batch;
  }

  /** The batch's typed arrays (to hand back to the thread they came from). */
  get columns(): StationColumns {
    const { round, setting, outcome, settingTimeHigh, settingTimeLow, outcomeTimeHigh, outcomeTimeLow } = this;
    return { round, setting, outcome, settingTimeHigh, settingTimeLow, outcomeTimeHigh, outcomeTimeLow };
  }

  /** Copies the rows held into `target` (columns of this batch's capacity and timing, or null for new ones); returns it. */
  copyInto(target: StationColumns | null): StationColumns {
    const columns = target ?? emptyColumns(this.capacity, this.timed);
    for (const [name, column] of Object.entries(this.columns) as [keyof StationColumns, Float64Array | Uint8Array | null][]) {
      if (column !== null) columns[name]!.set(column.subarray(0, this.length));
    }
    return columns;
  }

  /** The rows in a batch of their own (for specs and stand-ins). */
  static of(rows: readonly StationRow[], timed = rows.some((row) => row.settingTime !== null)): StationBatch {
    const batch = new StationBatch(Math.max(rows.length, 1), timed);
    for (const row of rows) batch.push(row);
    return batch;
  }

  get full(): boolean {
    return this.length === this.capacity;
  }

  /** Appends a decoded row (its times are kept only when the batch is timed). */
  push(row: StationRow): void {
    const i = this.length++;
    this.round[i] = row.round;
    this.setting[i] = row.setting;
    this.outcome[i] = row.outcome;
    if (this.timed && row.settingTime !== null && row.outcomeTime !== null) {
      this.settingTimeHigh![i] = highPart(row.settingTime);
      this.settingTimeLow![i] = lowPart(row.settingTime);
      this.outcomeTimeHigh![i] = highPart(row.outcomeTime);
      this.outcomeTimeLow![i] = lowPart(row.outcomeTime);
    }
  }

  /** Row `i` as an object (for specs and rare paths; the readers' consumers read the columns). */
  row(i: number): StationRow {
    const timed = this.timed;
    return {
      round: this.round[i],
      setting: this.setting[i],
      outcome: this.outcome[i],
      settingTime: timed ? timeOfParts(this.settingTimeHigh![i], this.settingTimeLow![i]) : null,
      outcomeTime: timed ? timeOfParts(this.outcomeTimeHigh![i], this.outcomeTimeLow![i]) : null,
    };
  }

  /** Every row as an object. */
  rows(): StationRow[] {
    return Array.from({ length: this.length }, (_, i) => this.row(i));
  }
}
