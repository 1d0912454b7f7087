import { CheckFinding, checkStatus } from '../checks/check-result';
import { logIntegrityCheck } from '../checks/log-integrity';
import { minimumTestRoundsCheck } from '../checks/minimum-test-rounds';
import { NO_SIGNALLING_CHECKS, noSignallingChecks } from '../checks/no-signalling';
import { SETTING_UNIFORMITY_CHECKS, settingUniformityChecks } from '../checks/setting-uniformity';
import { STATIONARITY_CHECKS, stationarityChecks } from '../checks/stationarity';
import { testMarkCheckCount, testMarkChecks } from '../checks/test-marks';
import { ENGINE_VERSION } from '../engine-version';
import { LogProblem } from '../log/log-problem';
import { RangeSummary } from '../log/range-analysis';
import { TriggerSpan } from '../log/range-plans';
import { AnalysisProfile, CheckFamily } from '../profile';
import { InputSummary, UnsealedResult } from '../result';
import { nestCounts } from '../tally/count-table';
import { blockSummaries } from './block-summary';
import { summariseChsh } from './chsh-summary';
import { summariseKey } from './key-summary';
import { summariseMissingRounds } from './missing-rounds';
import { summariseQber } from './qber-summary';
import { summariseSecurity } from './security-summary';
import { decideVerdict } from './verdict';

/** What every result records about its run, whatever the outcome. */
export interface RunContext {
  input: InputSummary;
  profile: AnalysisProfile;
  seed: string | null;
}

/** How many statistical checks a run under the profile makes: they share its significance (see `summariseSecurity`). */
export function statisticalCheckCount(profile: AnalysisProfile): number {
  return SETTING_UNIFORMITY_CHECKS + NO_SIGNALLING_CHECKS + STATIONARITY_CHECKS + testMarkCheckCount(profile);
}

/**
 * The check families whose failure aborts: the profile's, and stationarity under the collective
 * model, whose key figure assumes identical rounds (a drifting source voids it).
 */
export function blockingFamilies(profile: AnalysisProfile): CheckFamily[] {
  return profile.securityModel === 'collective' ? [...new Set<CheckFamily>([...profile.blockingChecks, 'stationarity'])] : profile.blockingChecks;
}

/** What a joined stream of two station records adds to the result of its rounds. */
export interface PairEvidence {
  /** The trigger span of both records. */
  span: TriggerSpan;
  /** Checks only a pair can make (its timing), judged with the others. */
  findings: readonly CheckFinding[];
}

/**
 * The result of a readable log, from the merged summary of all its stretches. The trigger span the
 * records stand for is by default from the first to the last record, whose missing rounds are the
 * gaps between records; a joined stream of two station records passes the span of both records
 * (`pair`), and the triggers it holds beyond the first and last joined round are missing rounds too
 * (their test decisions are in `log.missingTestRounds`: `RangeAnalysis.drawTriggersToSpanEnd`), with
 * the pair's own checks.
 */
export function assembleResult(log: RangeSummary, context: RunContext, pair?: PairEvidence): UnsealedResult {
  const { profile } = context;
  const span = pair?.span ?? recordSpan(log);
  const { test, generation } = log.counts;
  const all = test.map((count, cell) => count + generation[cell]);
  const beyondRecords = span.triggers - recordSpan(log).triggers;
  const missingRounds = summariseMissingRounds(span, log.gaps + beyondRecords, log.missingTestRounds, profile.missingRoundsTolerance);
  const chsh = summariseChsh(test, generation, profile.epsilon, log.missingTestRounds);
  const qber = summariseQber(test, generation, profile.epsilon);
  const key = summariseKey(chsh, qber, profile, log.validRecords);
  const blocks = blockSummaries(log.counts.blockStats, log.counts.blockRounds, profile.epsilon);
  const checkCount = statisticalCheckCount(profile);
  const perCheck = profile.significance / checkCount;
  const findings = [
    logIntegrityCheck(log.records, missingRounds),
    minimumTestRoundsCheck(chsh.rounds, qber.rounds, profile.minTestRounds),
    ...settingUniformityChecks(all, test, perCheck),
    ...noSignallingChecks(all, perCheck),
    ...stationarityChecks(blocks, perCheck),
    ...testMarkChecks(test, generation, profile, perCheck),
    ...(pair?.findings ?? []),
  ];
  const blocking = blockingFamilies(profile);
  const checks = findings.map((finding) => checkStatus(finding, blocking));
  const { verdict, reasons } = decideVerdict(chsh, qber, key, checks, profile);
  return {
    engineVersion: ENGINE_VERSION,
    ...context,
    selection: { mode: profile.testSelection.mode, testRounds: log.testRounds, generationRounds: log.validRecords - log.testRounds },
    missingRounds,
    counts: { test: nestCounts(test), generation: nestCounts(generation) },
    chsh,
    qber,
    key,
    security: summariseSecurity(profile, key, checkCount),
    checks,
    blocks,
    verdict,
    reasons,
    errors: [],
    errorCount: 0,
  };
}

/** The span from a log's first to its last record (none: 0 to −1, no triggers). */
function recordSpan(log: RangeSummary): TriggerSpan {
  const firstRound = log.first?.round ?? 0;
  const lastRound = log.last?.round ?? -1;
  return { firstRound, lastRound, triggers: lastRound - firstRound + 1 };
}

/** The result of a log that cannot be analysed: its first problems and how many there are. */
export function invalidResult(problems: readonly LogProblem[], problemCount: number, context: RunContext): UnsealedResult {
  const first = problems[0];
  const where = first ? ` The first is on line ${first.line}: ${first.message}.` : '';
  const summary = problemCount === 1 ? `The log has a problem.${where}` : `The log has ${problemCount} problems.${where}`;
  return refusedResult([summary], problems, problemCount, context);
}

/**
 * An INVALID result: nothing is analysed, `reasons` says why, `errors` lists the log's first
 * problems (none when the records are sound but cannot be judged, as two station records that do
 * not line up).
 */
export function refusedResult(reasons: string[], problems: readonly LogProblem[], problemCount: number, context: RunContext): UnsealedResult {
  return {
    engineVersion: ENGINE_VERSION,
    ...context,
    selection: null,
    missingRounds: null,
    counts: null,
    chsh: null,
    qber: null,
    key: null,
    security: null,
    checks: [],
    blocks: [],
    verdict: 'INVALID',
    reasons,
    errors: [...problems],
    errorCount: problemCount,
  };
}
