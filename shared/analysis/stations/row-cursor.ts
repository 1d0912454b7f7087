import { StationBatch } from './station-batch';

/** The batch a cursor holds before its first refill. */
const NO_ROWS = new StationBatch(0, false);

/**
 * Walks a stream of row batches one row at a time, holding one batch: the merge of two stations'
 * rows reads both in step without keeping more than a batch of either. Row `at` of `batch` is the
 * current row; `refill` is awaited only when a batch runs out, so the per-row path stays synchronous
 * (and a reader may refill the batch it handed out: it is asked for the next only once this one is
 * read).
 */
export class RowCursor {
  batch: StationBatch = NO_ROWS;
  at = 0;
  private ended = false;
  private readonly iterator: AsyncIterator<StationBatch>;

  constructor(rows: AsyncIterable<StationBatch>) {
    this.iterator = rows[Symbol.asyncIterator]();
  }

  /** Whether a row is at hand without waiting. */
  get hasRow(): boolean {
    return this.at < this.batch.length;
  }

  /** The current row's round index (only while `hasRow`). */
  get round(): number {
    return this.batch.round[this.at];
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
