/** One problem in a round log. */
export interface LogProblem {
  /** 1-based line number in the (decompressed) file; the header is line 1. */
  line: number;
  /** The header name of the column, or null for a problem with the whole row or file. */
  column: string | null;
  /** The offending text as written (a NUL byte shown as ␀), or null. */
  value: string | null;
  /** What is wrong, as a sentence. */
  message: string;
}

/** How many problems a result lists; all of them are counted. */
export const LISTED_PROBLEMS = 100;

/** What a NUL byte of the log shows as in a problem: U+2400, the symbol for null. */
export const SHOWN_NUL = '\u2400';

/**
 * A problem's text with each NUL shown as ␀: a result must be storable as it is, and PostgreSQL
 * refuses NUL in text and in jsonb strings (a NUL past the first 64 KiB reaches a value as written).
 */
function storable(text: string): string {
  return text.includes('\0') ? text.replaceAll('\0', SHOWN_NUL) : text;
}

/** Keeps the first problems of a log in order and counts all of them. */
export class ProblemList {
  /** The first `LISTED_PROBLEMS` problems. */
  readonly listed: LogProblem[] = [];
  /** How many problems were found in all. */
  count = 0;

  /** Records one problem. */
  add(line: number, column: string | null, value: string | null, message: string): void {
    this.count++;
    if (this.listed.length < LISTED_PROBLEMS) {
      this.listed.push({ line, column, value: value === null ? null : storable(value), message: storable(message) });
    }
  }
}
