import { StationRow } from './station-row';

/**
 * Walks a stream of row batches one row at a time, holding one batch: the merge of two stations'
 * rows reads both in step without keeping more than a batch of either. `row` is the current row;
 * `refill` is awaited only when a batch runs out, so the per-row path stays synchronous.
 */
export class RowCursor {
  private batch: readonly StationRow[] = [];
  private at = 0;
  private ended = false;
  private readonly iterator: AsyncIterator<readonly StationRow[]>;

  constructor(rows: AsyncIterable<readonly StationRow[]>) {
    this.iterator = rows[Symbol.asyncIterator]();
  }

  /** Whether a row is at hand without waiting. */
  get hasRow(): boolean {
    return this.at < this.batch.length;
  }

  /** The current row (only while `hasRow`). */
  get row(): StationRow {
    return this.batch[this.at];
  }

  /** Moves past the current row. */
  advance(): void {
    this.at++;
  }

  /** Fetches batches until a row is at hand or the stream ends; resolves to whether a row is at hand. */
  async refill(): Promise<boolean> {
    while (this.at >= this.batch.length && !this.ended) {
      const next = await this.iterator.next();
      if (next.done === true) {
        this.ended = true;
      } else {
        this.batch = next.value;
        this.at = 0;
      }
    }
    return this.at < this.batch.length;
  }

  /** Stops reading early, closing the stream. */
  async close(): Promise<void> {
    if (!this.ended) {
      this.ended = true;
      await this.iterator.return?.();
    }
  }
}
