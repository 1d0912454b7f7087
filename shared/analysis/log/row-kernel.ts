import { BulkSelection } from '../selection/test-selector';

/**
 * A reader of the common rows of a log (every field a plain integer in range, the header's field
 * count, a line break at the end), faster than the byte scanner's own loop: in Node, the WebAssembly
 * kernel of wasm/row-kernel.ts. It stops at the first other line, which the byte scanner reads, so
 * the rows it reads are exactly the ones the scanner would have read the same way.
 */
export interface RowKernel {
  /** Takes the bytes to read next (copied: the caller may reuse them afterwards). */
  load(bytes: Uint8Array): void;
  /**
   * Reads common rows of the loaded bytes from offset `from`, `limit` at most; returns the offset of
   * the line it stopped at. The rows: `rowCount`, their round indices in `rounds` and their codes in
   * `codes` (count cell in bits 0–4, the test marking in bit 5), valid until the next call.
   */
  read(from: number, limit: number): number;
  /**
   * Reads common rows from `from` and takes them as the range analysis takes a valid row that follows
   * the last (see `RangeAnalysis.takeRows`), from the state given; stops before a row it cannot take
   * so. Returns where it stopped and what the rows taken (`rowCount`) add.
   */
  step(from: number, start: KernelStepStart): KernelStep;
  readonly rowCount: number;
  readonly rounds: Float64Array;
  readonly codes: Uint8Array;
}

/** The state the kernel's step starts from. */
export interface KernelStepStart {
  selection: BulkSelection;
  /** The checker's last round index (NaN before the first: then no row follows). */
  lastRound: number;
  /** The round index whose trigger is decided next, and the span's last. */
  nextRound: number;
  spanLastRound: number;
  /** Records that still belong to the current stationarity block. */
  recordsLeftInBlock: number;
}

/** What a step took: state after it, and additions. */
export interface KernelStep {
  stop: number;
  uniformsUsed: number;
  remainingTests: number;
  remainingTriggers: number;
  lastRound: number;
  nextRound: number;
  gaps: number;
  missingTestRounds: number;
  testRounds: number;
  /** Counts per cell, generation then test (valid until the next call). */
  cellCounts: Float64Array;
  blockFirstRound: number;
  blockLastRound: number;
  blockStats: number[];
}

/** The code's bits: the count cell ((x·3 + y)·2 + a)·2 + b, and the test marking above it. */
export const ROW_CELL_MASK = 31;
export const ROW_TEST_SHIFT = 5;
