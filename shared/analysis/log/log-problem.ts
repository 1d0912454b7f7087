/** One problem in a round log. */
export interface LogProblem {
  /** 1-based line number in the (decompressed) file; the header is line 1. */
  line: number;
  /** The header name of the column, or null for a problem with the whole row or file. */
  column: string | null;
  /** The offending text as written, or null. */
  value: string | null;
  /** What is wrong, as a sentence. */
  message: string;
}

/** How many problems a result lists; all of them are counted. */
export const LISTED_PROBLEMS = 100;

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
      this.listed.push({ line, column, value, message });
    }
  }
}
