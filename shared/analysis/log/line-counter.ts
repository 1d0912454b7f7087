const LF = 10;
const CR = 13;

/** What the counting pass learns about a stretch of log. */
export interface LineCount {
  /** Lines started in the stretch (a last line without a line break counts). */
  lines: number;
  /** Non-blank lines: the records, each one round. */
  records: number;
}

/** Counts the lines and records of a text pushed in chunks cut anywhere. */
export interface LineCounting {
  /** Counts the lines of one chunk. */
  push(chunk: Uint8Array): void;
  /** The complete lines so far (a line still without its line break left out). */
  peek(): LineCount;
  /** The totals, counting a last line that lacks a line break. */
  finish(): LineCount;
}

/** The counts a line counter keeps, and how it ends: what both counters (TypeScript, WebAssembly) share. */
export abstract class LineTally implements LineCounting {
  protected lines = 0;
  protected records = 0;
  /** Bytes of the current, unfinished line seen so far. */
  protected pending = 0;

  abstract push(chunk: Uint8Array): void;

  peek(): LineCount {
    return { lines: this.lines, records: this.records };
  }

  finish(): LineCount {
    if (this.pending > 0) {
      this.lines++;
      this.records++;
      this.pending = 0;
    }
    return { lines: this.lines, records: this.records };
  }
}

/**
 * The counting pass: counts lines and records (non-blank lines; a line holding only the CR of a CRLF
 * is blank) with the same rules as the byte scanner, across chunk cuts. The rule itself, in
 * TypeScript; the engine counts with node/wasm-line-counter.ts where its WebAssembly was built,
 * which must agree with this (see its spec).
 */
export class LineCounter extends LineTally {
  /** Whether the unfinished line is exactly one CR. */
  private pendingIsCr = false;

  /** Counts the lines of one chunk. */
  push(chunk: Uint8Array): void {
    let from = 0;
    for (;;) {
      const newline = chunk.indexOf(LF, from);
      if (newline < 0) {
        const tail = chunk.length - from;
        if (tail > 0) {
          this.pendingIsCr = this.pending === 0 && tail === 1 && chunk[from] === CR;
          this.pending += tail;
        }
        return;
      }
      const length = this.pending + newline - from;
      const blank = length === 0 || (length === 1 && (this.pending === 1 ? this.pendingIsCr : chunk[from] === CR));
      this.lines++;
      this.records += blank ? 0 : 1;
      this.pending = 0;
      this.pendingIsCr = false;
      from = newline + 1;
    }
  }
}
