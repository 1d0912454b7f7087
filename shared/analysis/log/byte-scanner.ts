import { splitCsvLine } from './csv-line';
import { HeaderLayout } from './header-layout';
import { parseIntegerField } from './integer-field';
import { RangeAnalysis } from './range-analysis';
import { ROUND_FIELDS } from './round-fields';
import { RowKernel } from './row-kernel';

const LF = 10;
const CR = 13;
const COMMA = 44;
const QUOTE = 34;
const DIGIT_0 = 48;
const DIGIT_9 = 57;
const MINUS = 45;
const PLUS = 43;

/** Longest line accepted; a longer one is no round record (and would hold memory without bound). */
export const MAX_LINE_BYTES = 1 << 20;

/**
 * The fast reader: walks the bytes of a stretch once, splitting lines at LF (a CR before it is
 * dropped), fields at commas, and reading integers digit by digit without making strings. A line
 * that contains a quote is handed to the RFC 4180 line splitter instead, so quoting follows the same
 * rules as the reference reader (csv-parse). Chunks may cut lines anywhere: the cut line is carried
 * to the next chunk. Blank lines are skipped, like csv-parse's `skip_empty_lines`. With a row kernel,
 * the kernel reads the common rows and this loop only the lines it stops at.
 */
export class ByteScanner {
  private readonly values = new Float64Array(ROUND_FIELDS.length);
  private readonly decoder = new TextDecoder();
  private readonly fieldOfColumn: Int8Array;
  private carry: Uint8Array | null = null;
  private skippingLongLine = false;
  private line: number;
  private lineBytes: Uint8Array = new Uint8Array(0);
  private lineStart = 0;
  private lineEnd = 0;
  private readonly rawFields = (): string[] => {
    const split = splitCsvLine(this.decoder.decode(this.lineBytes.subarray(this.lineStart, this.lineEnd)));
    return 'fields' in split ? split.fields : [];
  };

  constructor(
    private readonly layout: HeaderLayout,
    private readonly analysis: RangeAnalysis,
    firstLine: number,
    private readonly kernel: RowKernel | null = null,
  ) {
    this.fieldOfColumn = Int8Array.from(layout.fieldOfColumn);
    this.line = firstLine;
  }

  /** The number the next line will have: lines read so far = nextLine − the first line's number. */
  get nextLine(): number {
    return this.line;
  }

  /** Reads the complete lines of `chunk` (after any line carried from the previous chunk). */
  push(chunk: Uint8Array): void {
    let from = 0;
    if (this.skippingLongLine) {
      const newline = chunk.indexOf(LF);
      if (newline < 0) {
        return;
      }
      this.skippingLongLine = false;
      from = newline + 1;
    } else if (this.carry !== null) {
      const newline = chunk.indexOf(LF);
      if (newline < 0) {
        this.extendCarry(chunk);
        return;
      }
      const joined = new Uint8Array(this.carry.length + newline + 1);
      joined.set(this.carry);
      joined.set(chunk.subarray(0, newline + 1), this.carry.length);
      this.carry = null;
      this.scan(joined, 0, false);
      from = newline + 1;
    }
    if (from >= chunk.length) {
      return;
    }
    const rest = this.scan(chunk, from, false);
    if (rest < chunk.length) {
      this.extendCarry(chunk.subarray(rest));
    }
  }

  /** Reads the last line, which may lack a line break. */
  finish(): void {
    if (this.carry !== null) {
      const last = this.carry;
      this.carry = null;
      this.scan(last, 0, true);
    }
  }

  private extendCarry(bytes: Uint8Array): void {
    const previous = this.carry ?? new Uint8Array(0);
    if (previous.length + bytes.length > MAX_LINE_BYTES) {
      this.tooLong(this.line++, previous.length > 0 ? previous : bytes);
      this.carry = null;
      this.skippingLongLine = true;
      return;
    }
    const joined = new Uint8Array(previous.length + bytes.length);
    joined.set(previous);
    joined.set(bytes, previous.length);
    this.carry = joined;
  }

  /**
   * Reads lines of `bytes` from `from`; returns where the first incomplete line starts (bytes.length
   * when none). With `atEnd`, the rest is the last line of the stretch.
   */
  private scan(bytes: Uint8Array, from: number, atEnd: boolean): number {
    const kernel = this.kernel;
    if (kernel === null) {
      return this.scanLines(bytes, from, atEnd, false);
    }
    kernel.load(bytes.subarray(from));
    let i = from;
    while (i < bytes.length) {
      const stop = this.analysis.takeRows(kernel, i - from, this.line) + from;
      const rows = kernel.rowCount;
      if (rows > 0) {
        this.line += rows;
        i = stop;
        continue;
      }
      // A line the kernel does not read: this loop reads it, or keeps it for the next chunk.
      const next = this.scanLines(bytes, i, atEnd, true);
      if (next === i) {
        return i;
      }
      i = next;
    }
    return bytes.length;
  }

  /**
   * Reads lines of `bytes` from `from` (just one with `oneLine`); returns where the first incomplete
   * line starts, or where it stopped after one line, or bytes.length. A one-digit field is read
   * with its separator in one step; another field in one tight loop over its digits (with an
   * optional sign before them); a field holding anything else is walked to its end and read as NaN,
   * noting a quote.
   */
  private scanLines(bytes: Uint8Array, from: number, atEnd: boolean, oneLine: boolean): number {
    const length = bytes.length;
    const fieldOfColumn = this.fieldOfColumn;
    const columns = fieldOfColumn.length;
    const values = this.values;
    let i = from;
    while (i < length) {
      const start = i;
      let field = 0;
      let quoted = false;
      let end = -1;
      for (;;) {
        let c = i < length ? bytes[i] : -1;
        // The commonest field of a round log, one digit and its separator, read in one step.
        const after = i + 1 < length ? bytes[i + 1] : -1;
        if (c >= DIGIT_0 && c <= DIGIT_9 && (after === COMMA || after === LF)) {
          const target = field < columns ? fieldOfColumn[field] : -1;
          if (target >= 0) {
            values[target] = c - DIGIT_0;
          }
          field++;
          i += 2;
          if (after === COMMA) {
            continue;
          }
          end = i - 1;
          break;
        }
        const negative = c === MINUS;
        if (negative || c === PLUS) {
          c = ++i < length ? bytes[i] : -1;
        }
        let value = 0;
        const firstDigit = i;
        while (c >= DIGIT_0 && c <= DIGIT_9) {
          value = value * 10 + (c - DIGIT_0);
          c = ++i < length ? bytes[i] : -1;
        }
        let number = i > firstDigit ? (negative ? -value : value) : NaN;
        // Anything after the digits other than a separator makes the field no integer.
        while (c !== COMMA && c !== LF && !(c === CR && i + 1 < length && bytes[i + 1] === LF)) {
          if (c < 0 || (c === CR && i + 1 >= length)) {
            if (!atEnd) {
              return start;
            }
            if (c < 0) {
              break;
            }
          }
          quoted ||= c === QUOTE;
          number = NaN;
          c = ++i < length ? bytes[i] : -1;
        }
        const target = field < columns ? fieldOfColumn[field] : -1;
        if (target >= 0) {
          values[target] = number;
        }
        field++;
        if (c === COMMA) {
          i++;
          continue;
        }
        end = i;
        i = c === CR ? i + 2 : i + 1;
        break;
      }
      this.readLine(bytes, start, end, field, quoted);
      if (oneLine) {
        return i;
      }
    }
    return length;
  }

  /** Reports a line too long to be a round record, with its first bytes. */
  private tooLong(line: number, start: Uint8Array): void {
    this.analysis.malformed(line, `${this.decoder.decode(start.subarray(0, 40))}…`, `the line is longer than ${MAX_LINE_BYTES} bytes: not a round record`);
  }

  private readLine(bytes: Uint8Array, start: number, end: number, fieldCount: number, quoted: boolean): void {
    const line = this.line++;
    if (end === start) {
      return;
    }
    // The same rule for a long line read whole from one chunk as for one carried across chunks.
    if (end - start > MAX_LINE_BYTES) {
      this.tooLong(line, bytes.subarray(start, end));
      return;
    }
    this.lineBytes = bytes;
    this.lineStart = start;
    this.lineEnd = end;
    if (!quoted) {
      this.analysis.accept(line, this.values, fieldCount, this.rawFields);
      return;
    }
    const text = this.decoder.decode(bytes.subarray(start, end));
    const split = splitCsvLine(text);
    if ('error' in split) {
      this.analysis.malformed(line, text, `the row's quoting is broken: ${split.error}`);
      return;
    }
    this.values.fill(NaN);
    split.fields.forEach((field, column) => {
      const target = column < this.fieldOfColumn.length ? this.fieldOfColumn[column] : -1;
      if (target >= 0) {
        this.values[target] = parseIntegerField(field);
      }
    });
    this.analysis.accept(line, this.values, split.fields.length, this.rawFields);
  }
}
