import { LineCounter, LineCounting } from './line-counter';
import { LastLineKeeper } from './record-edges';

/** Decoded bytes between two marks of a census, about: a mark is the first line start after each multiple. */
export const CENSUS_MARK_BYTES = 16 * 1024 * 1024;

/** A line start in a log's text, with the lines and records before it. */
export interface CensusMark {
  /** Byte offset in the decoded text. */
  offset: number;
  linesBefore: number;
  recordsBefore: number;
}

/** What the upload learns of a log while its bytes stream in (decoded bytes for gzip). */
export interface LogCensus {
  /** Bytes of the decoded text (equal to the stored bytes for a plain log). */
  decodedBytes: number;
  /** Lines, and records (non-blank lines, as the engine counts them), of the whole text, header included. */
  lines: number;
  records: number;
  /** About every CENSUS_MARK_BYTES of text: a line start, with the lines and records before it. */
  marks: CensusMark[];
  /**
   * The last non-blank line (base64 of its bytes, without its line break; null when none, or longer
   * than LONGEST_CENSUS_LINE): a gzip log's last round index, which one pass needs before it reads a round.
   */
  lastLine: string | null;
}

/** Longest last line a census keeps; a round record is a few dozen bytes. */
export const LONGEST_CENSUS_LINE = 4096;

const LF = 10;

/** The bytes of a census's last line, or null when it kept none. */
export function censusLastLine(census: LogCensus): Uint8Array | null {
  return census.lastLine === null ? null : Uint8Array.from(atob(census.lastLine), (character) => character.charCodeAt(0));
}

/**
 * Builds a census from the decoded bytes, chunk by chunk, with the line counter's rules (so its
 * counts are the engine's). It runs during every upload, so it only finds line breaks near the
 * mark offsets and counts the rest in bulk.
 */
export class LogCensusTaker {
  private readonly lastLine = new LastLineKeeper();
  private readonly marks: CensusMark[] = [];
  private bytes = 0;
  /** Offset from which the next mark's line start is sought. */
  private nextMark: number;

  /**
   * `markBytes`: text between marks (tests take small logs with many marks); `counter`: the line
   * counter (the engine's WebAssembly one in the upload, see node/wasm-line-counter.ts).
   */
  constructor(
    private readonly markBytes = CENSUS_MARK_BYTES,
    private readonly counter: LineCounting = new LineCounter(),
  ) {
    this.nextMark = markBytes;
  }

  push(chunk: Uint8Array): void {
    let from = 0;
    while (this.bytes + chunk.length > this.nextMark) {
      const seek = Math.max(this.nextMark - this.bytes, from);
      const newline = chunk.indexOf(LF, seek);
      if (newline < 0) break;
      // Count up to and including the line break, so the counter stands at the next line's start.
      this.counter.push(chunk.subarray(from, newline + 1));
      from = newline + 1;
      const { lines, records } = this.counter.peek();
      this.marks.push({ offset: this.bytes + from, linesBefore: lines, recordsBefore: records });
      this.nextMark = this.bytes + from + this.markBytes;
    }
    this.counter.push(from === 0 ? chunk : chunk.subarray(from));
    this.lastLine.push(chunk);
    this.bytes += chunk.length;
  }

  /** The census of everything pushed. */
  finish(): LogCensus {
    const { lines, records } = this.counter.finish();
    const last = this.lastLine.finish();
    const lastLine = last === null || last.length > LONGEST_CENSUS_LINE ? null : btoa(String.fromCharCode(...last));
    return { decodedBytes: this.bytes, lines, records, marks: this.marks.filter((mark) => mark.offset < this.bytes), lastLine };
  }
}
