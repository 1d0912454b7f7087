import { TestSelection } from '../profile';
import { KeystreamSource } from '../selection/keystream';
import { createTestSelector, SelectionStart, TestSelector } from '../selection/test-selector';
import { RoundTally, TallyCounts } from '../tally/round-tally';
import { HeaderLayout } from './header-layout';
import { LogProblem, ProblemList } from './log-problem';
import { TriggerSpan } from './range-plans';
import { RecordChecker, RoundMark } from './record-checker';
import { FIELD, ROUND_FIELDS } from './round-fields';
import { ROW_CELL_MASK, ROW_TEST_SHIFT, RowKernel } from './row-kernel';

// Field indices as module constants for the per-record path (see record-checker.ts).
const ROUND = FIELD.round;
const X = FIELD.x;
const Y = FIELD.y;
const A = FIELD.a;
const B = FIELD.b;
const TEST = FIELD.test;

/** A kernel row's fields as written are asked for only to describe a bad field, and it has none. */
const noFieldsNeeded = (): string[] => [];

/** Everything needed to analyse one stretch (byte range) of a log. Plain data, so it can go to a worker. */
export interface RangePlan {
  /** Resolved header. */
  layout: HeaderLayout;
  /** The profile's test selection. */
  selection: TestSelection;
  /** Line number of the stretch's first line. */
  firstLine: number;
  /** Index (0-based, in log order) of the stretch's first record, for the stationarity blocks. */
  firstRecord: number;
  /** Records in the whole log. */
  totalRecords: number;
  /** The log's trigger span. */
  span: TriggerSpan;
  /** Where the stretch starts among the triggers, and the totals. */
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
  /** Triggers missing from the log that were drawn for testing (every missing one, with the log's own marking). */
  missingTestRounds: number;
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
  private missingTestRounds = 0;
  /** A row rebuilt from its kernel code, for `accept`. */
  private readonly rowValues = new Float64Array(ROUND_FIELDS.length);
  private readonly fieldCount: number;
  private readonly plusMinus: boolean;
  /** The round index whose trigger the selector decides next. */
  private nextRound: number;
  private readonly lastRound: number;

  constructor(plan: RangePlan, keystream: KeystreamSource | null) {
    this.checker = new RecordChecker(plan.layout, this.problems);
    this.selector = createTestSelector(plan.selection, keystream, plan.start);
    this.tally = new RoundTally(Math.max(plan.totalRecords, 1), plan.blocks, plan.firstRecord);
    this.index = plan.firstRecord;
    this.nextRound = plan.span.firstRound + plan.start.firstTrigger;
    this.lastRound = plan.span.lastRound;
    this.fieldCount = plan.layout.fieldCount;
    this.plusMinus = plan.layout.outcomes === '±1';
  }

  /**
   * One record: see `RecordChecker.accept` for the arguments. The triggers missing before a valid
   * record take their test decisions first. A record of a log that is INVALID anyway (a bad field,
   * a round index out of order or past the log's last) takes none, so no selection runs wild.
   */
  accept(line: number, values: Float64Array, fieldCount: number, rawFields: () => string[]): void {
    const valid = this.checker.accept(line, values, fieldCount, rawFields);
    const index = this.index++;
    this.records++;
    if (!valid) {
      return;
    }
    const decoded = this.checker.decoded;
    const round = decoded[ROUND];
    if (round < this.nextRound || !(round <= this.lastRound)) {
      return;
    }
    if (round > this.nextRound) {
      this.missingTestRounds += this.selector.skip(round - this.nextRound);
    }
    this.nextRound = round + 1;
    const isTest = this.selector.next(decoded[TEST]);
    this.validRecords++;
    this.testRounds += isTest;
    this.tally.add(index, round, decoded[X], decoded[Y], decoded[A], decoded[B], isTest);
  }

  /**
   * Consecutive records read by the row kernel (see `RowKernel`), from line `firstLine`: whole rows
   * with every field in range, each given by its round index and code. What `accept` does, without
   * rebuilding the row unless its round index does not follow the previous one.
   */
  acceptRows(firstLine: number, count: number, rounds: Float64Array, codes: Uint8Array): void {
    const checker = this.checker;
    const selector = this.selector;
    const tally = this.tally;
    for (let k = 0; k < count; k++) {
      const round = rounds[k];
      const code = codes[k];
      if (!checker.acceptFollowing(firstLine + k, round)) {
        this.accept(firstLine + k, this.rebuiltRow(round, code), this.fieldCount, noFieldsNeeded);
        continue;
      }
      const index = this.index++;
      this.records++;
      if (round < this.nextRound || !(round <= this.lastRound)) {
        continue;
      }
      if (round > this.nextRound) {
        this.missingTestRounds += selector.skip(round - this.nextRound);
      }
      this.nextRound = round + 1;
      const isTest = selector.next(code >> ROW_TEST_SHIFT);
      this.validRecords++;
      this.testRounds += isTest;
      tally.addCell(index, round, code & ROW_CELL_MASK, isTest);
    }
  }

  /**
   * Lets the row kernel read common rows of its loaded bytes from `from` (line `firstLine`) and
   * take them itself, from this analysis's state, which then takes back what they added. Where the
   * kernel takes none (the stretch's first row, a row out of order, a long gap, a block's end) the
   * one row it reads is accepted here. Returns where the kernel stopped; the rows: `kernel.rowCount`.
   */
  takeRows(kernel: RowKernel, from: number, firstLine: number): number {
    const step = kernel.step(from, {
      selection: this.selector.bulk(),
      lastRound: this.checker.lastTaken,
      nextRound: this.nextRound,
      spanLastRound: this.lastRound,
      recordsLeftInBlock: this.tally.recordsLeftInBlock(this.index),
    });
    const rows = kernel.rowCount;
    if (rows === 0) {
      const stop = kernel.read(from, 1);
      this.acceptRows(firstLine, kernel.rowCount, kernel.rounds, kernel.codes);
      return stop;
    }
    this.checker.acceptRun(step.lastRound, firstLine + rows - 1, step.gaps);
    this.selector.settle(step.uniformsUsed, step.remainingTests, step.remainingTriggers);
    this.tally.addRun(step.cellCounts, step.blockFirstRound, step.blockLastRound, step.blockStats);
    this.index += rows;
    this.records += rows;
    this.validRecords += rows;
    this.testRounds += step.testRounds;
    this.missingTestRounds += step.missingTestRounds;
    this.nextRound = step.nextRound;
    return step.stop;
  }

  /** The values as written of a row the kernel read (outcomes ±1 written back as +1 / −1). */
  private rebuiltRow(round: number, code: number): Float64Array {
    const values = this.rowValues;
    const cell = code & ROW_CELL_MASK;
    const a = (cell >> 1) & 1;
    const b = cell & 1;
    values[ROUND] = round;
    values[X] = Math.floor(cell / 12);
    values[Y] = Math.floor(cell / 4) % 3;
    values[A] = this.plusMinus ? 1 - 2 * a : a;
    values[B] = this.plusMinus ? 1 - 2 * b : b;
    values[TEST] = code >> ROW_TEST_SHIFT;
    return values;
  }

  /**
   * Takes the test decisions of the triggers after the last record, up to the span's last round.
   * A log's span ends at its own last record, so there are none; a joined stream of two station
   * records ends where either record ends, and a round only one station recorded after the last
   * joined round is a missing round, drawn like any other (see shared/analysis/README.md, "Missing
   * rounds"). Call once, after the last record.
   */
  drawTriggersToSpanEnd(): void {
    if (this.nextRound <= this.lastRound) {
      this.missingTestRounds += this.selector.skip(this.lastRound - this.nextRound + 1);
      this.nextRound = this.lastRound + 1;
    }
  }

  /** One record whose quoting could not be read. */
  malformed(line: number, text: string, message: string): void {
    this.checker.malformed(line, text, message);
    this.index++;
    this.records++;
  }

  /** The stretch's contribution. */
  summary(): RangeSummary {
    return {
      records: this.records,
      validRecords: this.validRecords,
      testRounds: this.testRounds,
      missingTestRounds: this.missingTestRounds,
      counts: this.tally.counts(),
      problems: this.problems.listed,
      problemCount: this.problems.count,
      gaps: this.checker.gaps,
      first: this.checker.first,
      last: this.checker.last,
    };
  }
}
