import { AnalysisProfile } from '../profile';
import { KeystreamSource } from '../selection/keystream';
import { fixedFractionTests, testsBeforeTriggers } from '../selection/test-selector';
import { HeaderLayout } from './header-layout';
import { LineCount } from './line-counter';
import { LogProblem } from './log-problem';
import { RangePlan } from './range-analysis';
import { RecordEdges } from './record-edges';
import { FIELD } from './round-fields';

/** Line number of the first data line: the header is line 1. */
export const FIRST_DATA_LINE = 2;

/** The trigger span of a log: its first round index and how many triggers run to its last. */
export interface TriggerSpan {
  firstRound: number;
  lastRound: number;
  /** lastRound − firstRound + 1; the record count when the edges cannot be read (the log is then INVALID). */
  triggers: number;
}

/** The span between the log's edge round indices; falls back to the records when they cannot be read. */
export function triggerSpan(edges: RecordEdges, records: number): TriggerSpan {
  const { firstRound, lastRound } = edges;
  const readable = Number.isSafeInteger(firstRound) && Number.isSafeInteger(lastRound) && lastRound >= firstRound;
  return readable
    ? { firstRound, lastRound, triggers: lastRound - firstRound + 1 }
    : { firstRound: Number.isSafeInteger(firstRound) ? firstRound : 0, lastRound: NaN, triggers: records };
}

/**
 * A log whose round indices leave more triggers missing than it has records is no trigger count:
 * more than half of the rounds would be missing, and Bellkeep refuses to read it rather than draw
 * test rounds over a span the log does not cover (see shared/analysis/README.md, "Missing rounds").
 */
export function spanProblem(span: TriggerSpan, records: number, layout: HeaderLayout): LogProblem | null {
  if (span.triggers - records <= records) return null;
  const column = layout.columnNames[layout.columnOfField[FIELD.round]];
  return {
    line: FIRST_DATA_LINE,
    column,
    value: `${span.firstRound}…${span.lastRound}`,
    message: `the round indices run from ${span.firstRound} to ${span.lastRound} (${span.triggers} triggers) but the log holds ${records} rounds: more than half are missing; the round column must be the stations' trigger counter`,
  };
}

/**
 * The analysis plan of each stretch from the counting pass and the edge round indices: its first
 * line and record, and the trigger at which its selection starts (just after the last round of the
 * stretch before it, so the triggers missing at a seam are drawn once). For fixed-fraction
 * selection the thread that reads a stretch counts the test rounds chosen before it
 * (`withTestsBefore`), so every stretch decides exactly as one reader of the whole log would.
 */
export function planRanges(layout: HeaderLayout, profile: AnalysisProfile, counts: readonly LineCount[], edges: RecordEdges): RangePlan[] {
  const totalRecords = counts.reduce((sum, count) => sum + count.records, 0);
  const span = triggerSpan(edges, totalRecords);
  const selection = profile.testSelection;
  const totalTests = selection.mode === 'fixed-fraction' ? fixedFractionTests(selection.fraction, span.triggers) : 0;
  const firstRecords: number[] = [];
  const firstLines: number[] = [];
  counts.reduce(
    (at, count) => {
      firstRecords.push(at.record);
      firstLines.push(at.line);
      return { record: at.record + count.records, line: at.line + count.lines };
    },
    { record: 0, line: FIRST_DATA_LINE },
  );
  const firstTriggers = counts.map((_, i) => {
    const trigger = i === 0 ? 0 : edges.previousRounds[i] + 1 - span.firstRound;
    return Number.isSafeInteger(trigger) && trigger >= 0 ? trigger : 0;
  });
  return counts.map((_, i) => ({
    layout,
    selection,
    firstLine: firstLines[i],
    firstRecord: firstRecords[i],
    totalRecords,
    span,
    start: { firstTrigger: firstTriggers[i], totalTriggers: span.triggers, totalTests, testsBefore: 0 },
    blocks: profile.driftBlocks,
  }));
}

/**
 * The plan with the test rounds fixed-fraction selection chooses before its stretch, found by
 * running the selection over the keystream alone up to the stretch's first trigger (it never
 * depends on the data). Runs in the thread that reads the stretch, beside the other stretches.
 */
export function withTestsBefore(plan: RangePlan, keystream: KeystreamSource | null): RangePlan {
  if (plan.selection.mode !== 'fixed-fraction' || keystream === null || plan.start.firstTrigger === 0) {
    return plan;
  }
  const [testsBefore] = testsBeforeTriggers(keystream, plan.start.totalTriggers, plan.start.totalTests, [plan.start.firstTrigger]);
  return { ...plan, start: { ...plan.start, testsBefore } };
}
