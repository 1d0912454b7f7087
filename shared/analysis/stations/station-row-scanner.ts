import { PART_SCALE } from './picosecond-parts';
import { STATION_FIELDS } from './station-columns';
import { StationBatch } from './station-batch';
import { StationLayout } from './station-header';
import { LineSplitter } from './station-lines';
import { StationRecordChecker } from './station-record-checker';

const LF = 10;
const CR = 13;
const COMMA = 44;
const PLUS = 43;
const MINUS = 45;
const DIGIT_0 = 48;
const DIGIT_1 = 49;
const DIGIT_9 = 57;
/** Digits of a round index the fast path reads: 15 digits are always a safe integer (10^15 < 2^53). */
const ROUND_DIGITS = 15;
/** Digits of a time the fast path reads: 18 digits are always within 2^63 − 1. */
const TIME_DIGITS = 18;
/** Digits of a time's low part (`PART_SCALE` = 10^9). */
const LOW_DIGITS = Math.log10(PART_SCALE);
/** Where a position holds no row the fast path reads. */
const NOT_PLAIN = -1;

/**
 * Reads a station log's data bytes straight into a `StationBatch`. Most rows are read by a fast
 * path on the bytes themselves, without decoding or a string per line: a log whose columns are
 * `round,x,a` (or `y,b`) with the two times after them, in that order, and a row whose round index
 * is 1 to 15 digits, setting and outcome single characters as the log writes them (0/1, or ±1 with
 * an optional +), times 1 to 18 digits, ended by LF or CRLF, with its setting allowed. Such a row
 * the slower path would take with the same values. Everything else (another column order, a sign or
 * leading text, a bad field, a line cut by the end of the bytes, a blank or overlong line) goes
 * through the `LineSplitter` and `StationRecordChecker.acceptText`, which hold the rules and name
 * the problems; both paths count the same lines and check the same order.
 */
export class StationRowScanner {
  private readonly fast: boolean;
  private readonly timed: boolean;
  private readonly plusMinus: boolean;
  /** For each digit, whether it is an allowed setting. */
  private readonly settingAllowed = new Uint8Array(10);

  constructor(
    layout: StationLayout,
    private readonly checker: StationRecordChecker,
    /** Reads the lines the fast path does not; its listener adds their rows to the batch being filled. */
    private readonly splitter: LineSplitter,
    /** Hears of each record the fast path reads. */
    private readonly onRecord: () => void,
  ) {
    const canonical = STATION_FIELDS.slice(0, layout.fieldCount).every((_, column) => layout.columnOfField[column] === column);
    this.fast = canonical && (layout.fieldCount === 3 || (layout.fieldCount === 5 && layout.hasTimes));
    this.timed = layout.hasTimes;
    this.plusMinus = layout.outcomes === '±1';
    this.settingAllowed.forEach((_, digit) => (this.settingAllowed[digit] = checker.allowsSetting(digit) ? 1 : 0));
  }

  /**
   * Reads the rows of `bytes[from, to)` into `batch` until it is full (the splitter's listener must
   * add to the same batch); returns where it stopped. A line cut at `to` is carried by the splitter.
   */
  scan(bytes: Uint8Array, from: number, to: number, batch: StationBatch): number {
    let at = from;
    if (this.splitter.carrying) {
      at = this.handToSplitter(bytes, at, to);
    }
    while (at < to && !batch.full) {
      const end = this.fast ? this.readPlainRow(bytes, at, to, batch) : NOT_PLAIN;
      at = end === NOT_PLAIN ? this.handToSplitter(bytes, at, to) : end;
    }
    return at;
  }

  /** Hands the splitter the line at `at` up to its LF (or the rest, which it carries); returns the position after. */
  private handToSplitter(bytes: Uint8Array, at: number, to: number): number {
    const newline = bytes.subarray(at, to).indexOf(LF);
    const end = newline < 0 ? to : at + newline + 1;
    this.splitter.push(bytes.subarray(at, end));
    return end;
  }

  /** Reads one plain row at `at` into the batch; returns the position after its line break, or `NOT_PLAIN`. */
  private readPlainRow(bytes: Uint8Array, at: number, to: number, batch: StationBatch): number {
    let i = at;
    let round = 0;
    for (; i < to && bytes[i] >= DIGIT_0 && bytes[i] <= DIGIT_9; i++) round = round * 10 + (bytes[i] - DIGIT_0);
    if (i === at || i - at > ROUND_DIGITS || i + 4 >= to || bytes[i] !== COMMA) return NOT_PLAIN;
    const setting = bytes[i + 1] - DIGIT_0;
    if (setting < 0 || setting > 9 || this.settingAllowed[setting] === 0 || bytes[i + 2] !== COMMA) return NOT_PLAIN;
    i += 3;
    let outcome: number;
    if (this.plusMinus) {
      const sign = bytes[i];
      if (sign === MINUS || sign === PLUS) i++;
      if (i >= to || bytes[i] !== DIGIT_1) return NOT_PLAIN;
      outcome = sign === MINUS ? 1 : 0;
    } else {
      outcome = bytes[i] - DIGIT_0;
      if (outcome !== 0 && outcome !== 1) return NOT_PLAIN;
    }
    i++;
    const row = batch.length;
    if (this.timed) {
      i = this.readTime(bytes, i, to, batch.settingTimeHigh!, batch.settingTimeLow!, row);
      if (i === NOT_PLAIN) return NOT_PLAIN;
      i = this.readTime(bytes, i, to, batch.outcomeTimeHigh!, batch.outcomeTimeLow!, row);
      if (i === NOT_PLAIN) return NOT_PLAIN;
    }
    let end: number;
    if (i < to && bytes[i] === LF) end = i + 1;
    else if (i + 1 < to && bytes[i] === CR && bytes[i + 1] === LF) end = i + 2;
    else return NOT_PLAIN;
    this.onRecord();
    if (this.checker.acceptInRange(this.splitter.countLine(), round)) {
      batch.round[row] = round;
      batch.setting[row] = setting;
      batch.outcome[row] = outcome;
      batch.length++;
    }
    return end;
  }

  /** Reads `,digits` at `at` as a time into row `row` of the two part arrays; returns the position after it, or `NOT_PLAIN`. */
  private readTime(bytes: Uint8Array, at: number, to: number, high: Float64Array, low: Float64Array, row: number): number {
    if (at >= to || bytes[at] !== COMMA) return NOT_PLAIN;
    const first = at + 1;
    let end = first;
    while (end < to && bytes[end] >= DIGIT_0 && bytes[end] <= DIGIT_9) end++;
    if (end === first || end - first > TIME_DIGITS) return NOT_PLAIN;
    const split = Math.max(first, end - LOW_DIGITS);
    let value = 0;
    for (let i = first; i < split; i++) value = value * 10 + (bytes[i] - DIGIT_0);
    high[row] = value;
    value = 0;
    for (let i = split; i < end; i++) value = value * 10 + (bytes[i] - DIGIT_0);
    low[row] = value;
    return end;
  }
}
