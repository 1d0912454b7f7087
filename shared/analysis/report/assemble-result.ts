import { checkStatus } from '../checks/check-result';
import { logIntegrityCheck } from '../checks/log-integrity';
import { minimumTestRoundsCheck } from '../checks/minimum-test-rounds';
import { noSignallingChecks } from '../checks/no-signalling';
import { settingUniformityChecks } from '../checks/setting-uniformity';
import { stationarityChecks } from '../checks/stationarity';
import { ENGINE_VERSION } from '../engine-version';
import { LogProblem } from '../log/log-problem';
import { RangeSummary } from '../log/range-analysis';
import { AnalysisProfile } from '../profile';
import { InputSummary, UnsealedResult } from '../result';
import { nestCounts } from '../tally/count-table';
import { blockSummaries } from './block-summary';
import { summariseChsh } from './chsh-summary';
import { summariseKey } from './key-summary';
import { summariseQber } from './qber-summary';
import { decideVerdict } from './verdict';

/** What every result records about its run, whatever the outcome. */
export interface RunContext {
  input: InputSummary;
  profile: AnalysisProfile;
  seed: string | null;
}

/** The result of a readable log, from the merged summary of all its stretches. */
export function assembleResult(log: RangeSummary, context: RunContext): UnsealedResult {
  const { profile } = context;
  const { test, generation } = log.counts;
  const all = test.map((count, cell) => count + generation[cell]);
  const chsh = summariseChsh(test, profile.epsilon);
  const qber = summariseQber(test, generation, profile.epsilon);
  const key = summariseKey(chsh, qber, profile, log.validRecords);
  const blocks = blockSummaries(log.counts.blockStats, log.counts.blockRounds, profile.epsilon);
  const findings = [
    logIntegrityCheck(log.records, log.gaps, log.first?.round ?? null, log.last?.round ?? null),
    minimumTestRoundsCheck(chsh.rounds, qber.rounds, profile.minTestRounds),
    ...settingUniformityChecks(all, profile.significance),
    ...noSignallingChecks(all, profile.significance),
    ...stationarityChecks(blocks, profile.significance),
  ];
  const checks = findings.map((finding) => checkStatus(finding, profile.blockingChecks));
  const { verdict, reasons } = decideVerdict(chsh, qber, key, checks, profile);
  return {
    engineVersion: ENGINE_VERSION,
    ...context,
    selection: { mode: profile.testSelection.mode, testRounds: log.testRounds, generationRounds: log.validRecords - log.testRounds },
    counts: { test: nestCounts(test), generation: nestCounts(generation) },
    chsh,
    qber,
    key,
    checks,
    blocks,
    verdict,
    reasons,
    errors: [],
    errorCount: 0,
  };
}

/** The result of a log that cannot be analysed: its first problems and how many there are. */
export function invalidResult(problems: readonly LogProblem[], problemCount: number, context: RunContext): UnsealedResult {
  const first = problems[0];
  const where = first ? ` The first is on line ${first.line}: ${first.message}.` : '';
  const summary = problemCount === 1 ? `The log has a problem.${where}` : `The log has ${problemCount} problems.${where}`;
  return {
    engineVersion: ENGINE_VERSION,
    ...context,
    selection: null,
    counts: null,
    chsh: null,
    qber: null,
    key: null,
    checks: [],
    blocks: [],
    verdict: 'INVALID',
    reasons: [summary],
    errors: [...problems],
    errorCount: problemCount,
  };
}
