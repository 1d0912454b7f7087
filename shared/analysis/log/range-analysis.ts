import { TestSelection } from '../profile';
import { KeystreamSource } from '../selection/keystream';
import { createTestSelector, SelectionStart, TestSelector } from '../selection/test-selector';
import { RoundTally, TallyCounts } from '../tally/round-tally';
import { HeaderLayout } from './header-layout';
import { LogProblem, ProblemList } from './log-problem';
import { RecordChecker, RoundMark } from './record-checker';
import { FIELD } from './round-fields';

// Field indices as module constants for the per-record path (see record-checker.ts).
const ROUND = FIELD.round;
const X = FIELD.x;
const Y = FIELD.y;
const A = FIELD.a;
const B = FIELD.b;
const TEST = FIELD.test;

/** Everything needed to analyse one stretch (byte range) of a log. Plain data, so it can go to a worker. */
export interface RangePlan {
  /** Resolved header. */
  layout: HeaderLayout;
  /** The profile's test selection. */
  selection: TestSelection;
  /** Line number of the stretch's first line. */
  firstLine: number;
  /** Where the stretch starts among the rounds, and the totals. */
  start: SelectionStart;
  /** Number of stationarity blocks. */
  blocks: number;
}

/** What one stretch of the log contributes; stretches merge exactly, in order. */
export interface RangeSummary {
  /** Records (non-blank lines) read. */
  records: number;
  /** Valid records counted. */
  validRecords: number;
  /** Test rounds among them. */
  testRounds: number;
  /** The counts. */
  counts: TallyCounts;
  /** The first problems, in order. */
  problems: LogProblem[];
  /** All problems found. */
  problemCount: number;
  /** Missing round indices inside the stretch. */
  gaps: number;
  /** First readable round index. */
  first: RoundMark | null;
  /** Last readable round index. */
  last: RoundMark | null;
}

/**
 * Receives the records of one stretch from a reader (the fast byte scanner or the csv-parse
 * reference), checks each, decides test or generation, and tallies it.
 */
export class RangeAnalysis {
  private readonly problems = new ProblemList();
  private readonly checker: RecordChecker;
  private readonly selector: TestSelector;
  private readonly tally: RoundTally;
  private index: number;
  private records = 0;
  private validRecords = 0;
  private testRounds = 0;

  constructor(plan: RangePlan, keystream: KeystreamSource | null) {
    this.checker = new RecordChecker(plan.layout, this.problems);
    this.selector = createTestSelector(plan.selection, keystream, plan.start);
    this.tally = new RoundTally(Math.max(plan.start.totalRounds, 1), plan.blocks, plan.start.firstRound);
    this.index = plan.start.firstRound;
  }

  /** One record: see `RecordChecker.accept` for the arguments. */
  accept(line: number, values: Float64Array, fieldCount: number, rawFields: () => string[]): void {
    const valid = this.checker.accept(line, values, fieldCount, rawFields);
    const decoded = this.checker.decoded;
    const isTest = this.selector.next(decoded[TEST]);
    if (valid) {
      this.validRecords++;
      this.testRounds += isTest ? 1 : 0;
      this.tally.add(this.index, decoded[ROUND], decoded[X], decoded[Y], decoded[A], decoded[B], isTest);
    }
    this.index++;
    this.records++;
  }

  /** One record whose quoting could not be read. */
  malformed(line: number, text: string, message: string): void {
    this.checker.malformed(line, text, message);
    this.selector.next(NaN);
    this.index++;
    this.records++;
  }

  /** The stretch's contribution. */
  summary(): RangeSummary {
    return {
      records: this.records,
      validRecords: this.validRecords,
      testRounds: this.testRounds,
      counts: this.tally.counts(),
      problems: this.problems.listed,
      problemCount: this.problems.count,
      gaps: this.checker.gaps,
      first: this.checker.first,
      last: this.checker.last,
    };
  }
}
