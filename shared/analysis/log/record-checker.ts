import { HeaderLayout } from './header-layout';
import { ProblemList } from './log-problem';
import { FIELD, FIELD_MEANING, ROUND_FIELDS } from './round-fields';

/** The first round index of a stretch of log, kept so stretches read apart can be checked in order. */
export interface RoundMark {
  /** The round index. */
  round: number;
  /** Its line. */
  line: number;
}

/** Allowed values of each field (after outcome decoding), for the checks and messages. */
const ALLOWED: Record<'x' | 'y' | 'a' | 'b' | 'test', readonly number[]> = { x: [0, 1], y: [0, 1, 2], a: [0, 1], b: [0, 1], test: [0, 1] };

// Field indices as module constants: the per-record path reads them millions of times, and imported
// bindings can compile to property getters.
const ROUND = FIELD.round;
const X = FIELD.x;
const Y = FIELD.y;
const A = FIELD.a;
const B = FIELD.b;
const TEST = FIELD.test;
const LARGEST_ROUND = Number.MAX_SAFE_INTEGER;

/**
 * Checks one record at a time against the log rules (field count, integers, ranges, round indices
 * strictly increasing) and decodes its values. Problems go to the problem list with line, column and
 * the text as written; the first valid round index is kept for the check across stretches.
 */
export class RecordChecker {
  /** The decoded values of the last accepted record, indexed by `FIELD`. */
  readonly decoded = new Float64Array(ROUND_FIELDS.length);
  /** Missing round indices between consecutive valid rows. */
  gaps = 0;
  /** The first readable round index seen. */
  first: RoundMark | null = null;
  private lastRound = -1;
  private lastLine = 0;
  private readonly presentFields: number[];
  private readonly fieldCount: number;
  private readonly plusMinus: boolean;
  private readonly hasTest: boolean;
  private readonly roundColumn: string;

  constructor(
    private readonly layout: HeaderLayout,
    private readonly problems: ProblemList,
  ) {
    this.presentFields = ROUND_FIELDS.map((_, field) => field).filter((field) => layout.columnOfField[field] >= 0);
    this.fieldCount = layout.fieldCount;
    this.plusMinus = layout.outcomes === '±1';
    this.hasTest = layout.columnOfField[TEST] >= 0;
    this.roundColumn = layout.columnNames[layout.columnOfField[ROUND]];
  }

  /** The last readable round index seen. */
  get last(): RoundMark | null {
    return this.first === null ? null : { round: this.lastRound, line: this.lastLine };
  }

  /**
   * Checks a record: `values` holds the integer read from each field's column (NaN if it was not an
   * integer), `fieldCount` the number of fields in the row, `rawFields` gives the row's fields as
   * written (called only to describe a problem). Returns whether the record is valid.
   */
  accept(line: number, values: Float64Array, fieldCount: number, rawFields: () => string[]): boolean {
    const round = values[ROUND];
    const x = values[X];
    const y = values[Y];
    let a = values[A];
    let b = values[B];
    if (this.plusMinus) {
      a = a === 1 ? 0 : a === -1 ? 1 : NaN;
      b = b === 1 ? 0 : b === -1 ? 1 : NaN;
    }
    const test = this.hasTest ? values[TEST] : 0;
    // Each value is an integer or NaN, so a range check is the whole check; written as bounds, whose
    // outcome the processor predicts, rather than as a choice among values, which it cannot.
    const inRange = round >= 0 && round <= LARGEST_ROUND && x >= 0 && x <= 1 && y >= 0 && y <= 2 && a >= 0 && a <= 1 && b >= 0 && b <= 1 && test >= 0 && test <= 1;
    // The common case first: a whole, valid row whose round index follows the previous one.
    if (fieldCount !== this.fieldCount || !inRange || !(round > this.lastRound) || this.first === null) {
      return this.checkUncommon(line, values, fieldCount, rawFields, inRange);
    }
    this.gaps += round - this.lastRound - 1;
    this.lastRound = round;
    this.lastLine = line;
    const decoded = this.decoded;
    decoded[ROUND] = round;
    decoded[X] = x;
    decoded[Y] = y;
    decoded[A] = a;
    decoded[B] = b;
    decoded[TEST] = test;
    return true;
  }

  /**
   * The common case of `accept` for a row already read whole and in range (by the row kernel): when
   * its round index follows the previous one, takes it and returns true; else leaves it to `accept`.
   */
  acceptFollowing(line: number, round: number): boolean {
    if (!(round > this.lastRound) || this.first === null) {
      return false;
    }
    this.gaps += round - this.lastRound - 1;
    this.lastRound = round;
    this.lastLine = line;
    return true;
  }

  /** The last round index taken, or NaN before the first (a row must be above it to follow). */
  get lastTaken(): number {
    return this.first === null ? NaN : this.lastRound;
  }

  /** Takes a run of following rows checked elsewhere (the row kernel): the last one's round index and line, the gaps among them. */
  acceptRun(lastRound: number, lastLine: number, gaps: number): void {
    this.gaps += gaps;
    this.lastRound = lastRound;
    this.lastLine = lastLine;
  }

  /** A row of the wrong length, with a bad field, or the first row or one out of order. */
  private checkUncommon(line: number, values: Float64Array, fieldCount: number, rawFields: () => string[], inRange: boolean): boolean {
    if (fieldCount !== this.fieldCount) {
      this.problems.add(line, null, null, `the row has ${fieldCount} fields, the header has ${this.fieldCount}`);
      return false;
    }
    if (!inRange) {
      return this.describeProblems(line, values, rawFields);
    }
    const round = values[ROUND];
    const decoded = this.decoded;
    decoded[ROUND] = round;
    decoded[X] = values[X];
    decoded[Y] = values[Y];
    decoded[A] = this.plusMinus ? (values[A] === 1 ? 0 : 1) : values[A];
    decoded[B] = this.plusMinus ? (values[B] === 1 ? 0 : 1) : values[B];
    decoded[TEST] = this.hasTest ? values[TEST] : 0;
    return this.checkOrder(line, round);
  }

  /** Describes a record whose quoting could not be read. */
  malformed(line: number, text: string, message: string): void {
    this.problems.add(line, null, text, message);
  }

  /** The slow path for a record with a bad field: one problem per bad field, then the order check. */
  private describeProblems(line: number, values: Float64Array, rawFields: () => string[]): false {
    let roundReadable = false;
    for (const field of this.presentFields) {
      const message = this.fieldProblem(field, values[field]);
      if (message === null) {
        roundReadable ||= field === ROUND;
        continue;
      }
      const column = this.layout.columnOfField[field];
      this.problems.add(line, this.layout.columnNames[column], rawFields()[column] ?? null, message);
    }
    if (roundReadable) {
      this.checkOrder(line, values[ROUND]);
    }
    return false;
  }

  private fieldProblem(field: number, value: number): string | null {
    const name = ROUND_FIELDS[field];
    if (Number.isNaN(value)) {
      return `the ${FIELD_MEANING[name]} is not an integer`;
    }
    if (name === 'round') {
      return value >= 0 && value <= LARGEST_ROUND ? null : `the round index must be a whole number from 0 to ${LARGEST_ROUND}`;
    }
    const plusMinus = this.plusMinus && (name === 'a' || name === 'b');
    const decoded = plusMinus ? (value === 1 ? 0 : value === -1 ? 1 : NaN) : value;
    if (ALLOWED[name].includes(decoded)) {
      return null;
    }
    return plusMinus ? `the ${FIELD_MEANING[name]} must be +1 or -1` : `the ${FIELD_MEANING[name]} must be ${allowedText(ALLOWED[name])}`;
  }

  /** Checks the round index against the previous readable one; returns false on a repeat or a step back. */
  private checkOrder(line: number, round: number): boolean {
    const previousRound = this.lastRound;
    const previousLine = this.lastLine;
    this.lastRound = round;
    this.lastLine = line;
    if (this.first === null) {
      this.first = { round, line };
      return true;
    }
    if (round > previousRound) {
      this.gaps += round - previousRound - 1;
      return true;
    }
    return recordOrder({ round: previousRound, line: previousLine }, { round, line }, this.problems, this.roundColumn, (gap) => (this.gaps += gap));
  }
}

/**
 * Checks that `next` follows `previous` (strictly increasing round indices): a repeat or a step back is
 * a problem at `next`'s line; otherwise the missing indices between them are passed to `onGap`.
 */
export function recordOrder(previous: RoundMark, next: RoundMark, problems: ProblemList, column: string, onGap: (gap: number) => void): boolean {
  if (next.round === previous.round) {
    problems.add(next.line, column, String(next.round), `round index ${next.round} repeats (also on line ${previous.line})`);
    return false;
  }
  if (next.round < previous.round) {
    problems.add(next.line, column, String(next.round), `round index ${next.round} goes back (line ${previous.line} has ${previous.round})`);
    return false;
  }
  onGap(next.round - previous.round - 1);
  return true;
}

/** "0 or 1", "0, 1 or 2". */
function allowedText(values: readonly number[]): string {
  return `${values.slice(0, -1).join(', ')} or ${values[values.length - 1]}`;
}
