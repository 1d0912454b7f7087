import { LogProblem } from '../log/log-problem';
import { RangeSummary } from '../log/range-analysis';
import { InputSummary } from '../result';

/** What reading a log produced: its summary, or the problems that make it unreadable. */
export type ReadOutcome =
  | { kind: 'read'; input: Omit<InputSummary, 'mapping'>; summary: RangeSummary }
  | { kind: 'unreadable'; input: Omit<InputSummary, 'mapping'>; problems: LogProblem[]; problemCount: number };

/** The problem of a log with a header and no rounds. */
export const NO_ROUNDS: LogProblem = { line: 2, column: null, value: null, message: 'the log has a header but no rounds' };
