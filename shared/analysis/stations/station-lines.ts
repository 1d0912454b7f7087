import { MAX_LINE_BYTES } from '../log/byte-scanner';

const LF = 10;
const CR_TEXT = '\r';

/** Hears each line of a text: its number and its text without the line break (a CRLF's CR dropped). */
export type LineListener = (line: number, text: string) => void;

/** Hears of a line too long to be a record: its number and its first characters. */
export type LongLineListener = (line: number, start: string) => void;

/**
 * Splits bytes cut anywhere into numbered lines of text, by the joined log's rules: LF ends a line
 * and a CR just before it is dropped (a lone CR is no line break, and the last line keeps a CR it
 * ends with), blank lines (empty, or only the CR of a CRLF) are skipped but counted, and a line
 * longer than `MAX_LINE_BYTES` bytes is no record (reported once and skipped, so it never holds
 * memory without bound). Only whole lines are decoded (UTF-8, never cutting a character: an LF is
 * never part of one), each stretch at once.
 */
export class LineSplitter {
  private readonly decoder = new TextDecoder();
  /** The bytes of the unfinished line. */
  private carry: Uint8Array = new Uint8Array(0);
  private skippingLongLine = false;

  constructor(
    private line: number,
    private readonly onLine: LineListener,
    private readonly onLongLine: LongLineListener,
  ) {}

  /** The number the next line will have. */
  get nextLine(): number {
    return this.line;
  }

  /** Whether an unfinished line is carried (its rest comes with the next bytes). */
  get carrying(): boolean {
    return this.carry.length > 0 || this.skippingLongLine;
  }

  /** Counts a line read elsewhere (only between lines: nothing carried); returns its number. */
  countLine(): number {
    return this.line++;
  }

  /** Reads the complete lines of `chunk` (after any line carried from the chunk before). */
  push(chunk: Uint8Array): void {
    const firstNewline = chunk.indexOf(LF);
    if (firstNewline < 0) {
      this.extendCarry(chunk);
      return;
    }
    // The carried line ends here: read it, or count it when it was too long to keep.
    this.extendCarry(chunk.subarray(0, firstNewline));
    if (this.skippingLongLine) {
      this.skippingLongLine = false;
      this.line++;
    } else {
      this.emit(this.decoder.decode(this.carry), true);
    }
    this.carry = new Uint8Array(0);
    const lastNewline = chunk.lastIndexOf(LF);
    if (lastNewline > firstNewline) {
      this.emitLines(this.decoder.decode(chunk.subarray(firstNewline + 1, lastNewline)));
    }
    this.extendCarry(chunk.subarray(lastNewline + 1));
  }

  /** Reads the last line, which may lack a line break. */
  finish(): void {
    if (!this.skippingLongLine && this.carry.length > 0) {
      this.emit(this.decoder.decode(this.carry), false);
    }
    this.carry = new Uint8Array(0);
  }

  /** Lines separated by LF, each ended by one (the last one's LF is not in `text`). */
  private emitLines(text: string): void {
    let from = 0;
    for (;;) {
      const newline = text.indexOf('\n', from);
      if (newline < 0) {
        this.emit(from === 0 ? text : text.slice(from), true);
        return;
      }
      this.emit(text.slice(from, newline), true);
      from = newline + 1;
    }
  }

  private extendCarry(bytes: Uint8Array): void {
    if (this.skippingLongLine || bytes.length === 0) {
      return;
    }
    if (this.carry.length + bytes.length > MAX_LINE_BYTES) {
      const start = this.carry.length > 0 ? this.carry : bytes;
      this.onLongLine(this.line, this.decoder.decode(start.subarray(0, 40)));
      this.carry = new Uint8Array(0);
      this.skippingLongLine = true;
      return;
    }
    const joined = new Uint8Array(this.carry.length + bytes.length);
    joined.set(this.carry);
    joined.set(bytes, this.carry.length);
    this.carry = joined;
  }

  /** One line; only a line ended by LF loses a CR at its end (a last line's CR stays, as in the joined log). */
  private emit(withCr: string, ended: boolean): void {
    const line = this.line++;
    const text = ended && withCr.endsWith(CR_TEXT) ? withCr.slice(0, -1) : withCr;
    if (text === '') {
      return;
    }
    if (text.length > MAX_LINE_BYTES) {
      this.onLongLine(line, text.slice(0, 40));
      return;
    }
    this.onLine(line, text);
  }
}
