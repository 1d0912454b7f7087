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
  /** The first valid round index seen. */
  first: RoundMark | null = null;
  /** The last valid round index seen. */
  last: RoundMark | null = null;
  private readonly presentFields: number[];

  constructor(
    private readonly layout: HeaderLayout,
    private readonly problems: ProblemList,
  ) {
    this.presentFields = ROUND_FIELDS.map((_, field) => field).filter((field) => layout.columnOfField[field] >= 0);
  }

  /**
   * Checks a record: `values` holds the integer read from each field's column (NaN if it was not an
   * integer), `fieldCount` the number of fields in the row, `rawFields` gives the row's fields as
   * written (called only to describe a problem). Returns whether the record is valid.
   */
  accept(line: number, values: Float64Array, fieldCount: number, rawFields: () => string[]): boolean {
    if (fieldCount !== this.layout.fieldCount) {
      this.problems.add(line, null, null, `the row has ${fieldCount} fields, the header has ${this.layout.fieldCount}`);
      return false;
    }
    let valid = true;
    let roundReadable = false;
    for (const field of this.presentFields) {
      const message = this.fieldProblem(field, values[field]);
      if (message === null) {
        roundReadable ||= field === FIELD.round;
        continue;
      }
      valid = false;
      const column = this.layout.columnOfField[field];
      this.problems.add(line, this.layout.columnNames[column], rawFields()[column] ?? null, message);
    }
    return roundReadable && this.checkOrder(line) && valid;
  }

  /** Describes a record whose quoting could not be read. */
  malformed(line: number, text: string, message: string): void {
    this.problems.add(line, null, text, message);
  }

  private fieldProblem(field: number, value: number): string | null {
    const name = ROUND_FIELDS[field];
    if (Number.isNaN(value)) {
      return `the ${FIELD_MEANING[name]} is not an integer`;
    }
    if (name === 'round') {
      this.decoded[field] = value;
      return value >= 0 && value <= Number.MAX_SAFE_INTEGER ? null : `the round index must be a whole number from 0 to ${Number.MAX_SAFE_INTEGER}`;
    }
    const plusMinus = this.layout.outcomes === '±1' && (name === 'a' || name === 'b');
    const decoded = plusMinus ? (value === 1 ? 0 : value === -1 ? 1 : NaN) : value;
    this.decoded[field] = decoded;
    if (ALLOWED[name].includes(decoded)) {
      return null;
    }
    return plusMinus ? `the ${FIELD_MEANING[name]} must be +1 or -1` : `the ${FIELD_MEANING[name]} must be ${allowedText(ALLOWED[name])}`;
  }

  /** Checks the round index against the previous valid one; returns false on a repeat or a step back. */
  private checkOrder(line: number): boolean {
    const previous = this.last;
    this.last = { round: this.decoded[FIELD.round], line };
    if (previous === null) {
      this.first = this.last;
      return true;
    }
    return recordOrder(previous, this.last, this.problems, this.layout.columnNames[this.layout.columnOfField[FIELD.round]], (gap) => (this.gaps += gap));
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
