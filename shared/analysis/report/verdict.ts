import { checkLabel } from '../../format/check-labels';
import { CheckResult } from '../checks/check-result';
import { AnalysisProfile } from '../profile';
import { LOCAL_WIN_FRACTION, QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { chshValueFromWinFraction } from '../statistics/chsh-value';
import { Verdict } from '../result';
import { ChshSummary } from './chsh-summary';
import { KeySummary } from './key-summary';
import { QberSummary } from './qber-summary';

/** The verdict on a readable log and the reasons for an abort. */
export interface VerdictFinding {
  verdict: Exclude<Verdict, 'INVALID'>;
  reasons: string[];
}

/** What the general model's acceptance count needs of the run's sub-protocol (see `GeneralKeySummary`). */
export interface GeneralAcceptance {
  /** Rounds n′ of the sub-protocol. */
  rounds: number;
  /** Its test probability γ′. */
  testProbability: number;
  /** The acceptance threshold ω_thr. */
  omegaThreshold: number;
}

/**
 * ACCEPT only when every rule holds; each rule that fails is a sentence in the reasons:
 * - every CHSH setting pair has test rounds (the win fraction weighs the four equally);
 * - the CHSH criterion (`chshCriterion`): the profile's threshold, or the general model's count;
 * - a real violation: the lower confidence bound of the win fraction is above ¾, under every
 *   criterion (Gill 2003; Hensen et al., Nature 526, 682 (2015) judged significance the same way);
 * - a physical bound: that lower bound is not above ω_Q = (2 + √2)/4, i.e. S_low ≤ 2√2 (Tsirelson
 *   1980): above it the data or its analysis is broken, never the device better;
 * - the error-rate criterion (`qberCriterion`);
 * - no test of the log that aborts a run (a blocking check) failed;
 * - if the profile asks, a positive key of its attack model.
 */
export function decideVerdict(chsh: ChshSummary, qber: QberSummary, key: KeySummary, checks: readonly CheckResult[], profile: AnalysisProfile): VerdictFinding {
  const reasons = [...chshReasons(chsh, profile, key.generalAttack)];
  const rateCriterion = qberCriterion(qber, profile);
  if (rateCriterion.value === null) {
    reasons.push('There are no key-setting test rounds.');
  } else if (!rateCriterion.passes) {
    reasons.push(`The ${rateCriterion.name} on the key setting ${rateCriterion.value.toFixed(6)} is above the tolerance ${profile.qberTolerance}.`);
  }
  for (const check of checks.filter((c) => c.status === 'fail')) {
    reasons.push(`The test “${checkLabel(check.id)}” failed: ${check.message}`);
  }
  if (profile.requirePositiveKey && profile.securityModel === 'general') {
    if (!key.generalAttackBits)
      reasons.push(`The key length against general attacks is not positive, and the profile requires a key.${key.generalAttack?.reason ? ` ${key.generalAttack.reason}` : ''}`);
  } else if (profile.requirePositiveKey && key.finiteKeyBits <= 0) {
    reasons.push(`The finite key length is not positive, and the profile requires a key.${key.finiteKeyReason ? ` ${key.finiteKeyReason}` : ''}`);
  }
  return { verdict: reasons.length === 0 ? 'ACCEPT' : 'ABORT', reasons };
}

/** Whether the CHSH rules of `decideVerdict` all hold (for the planner's pass probabilities). */
export function chshRulesHold(chsh: ChshSummary, profile: AnalysisProfile, general: GeneralAcceptance | null): boolean {
  return chshReasons(chsh, profile, general).length === 0;
}

/** The CHSH rules: setting pairs present, the criterion, a significant violation, the quantum bound. */
function chshReasons(chsh: ChshSummary, profile: AnalysisProfile, general: GeneralAcceptance | null): string[] {
  if (chsh.rounds === 0) return ['There are no CHSH test rounds.'];
  const empty = chsh.pairs.filter((pair) => pair.testRounds === 0).map((pair) => `(${pair.x}, ${pair.y})`);
  if (empty.length > 0) {
    return [
      `The CHSH setting pair${empty.length > 1 ? 's' : ''} ${empty.join(', ')} ha${empty.length > 1 ? 've' : 's'} no test rounds: the win fraction cannot weigh the four pairs equally.`,
    ];
  }
  const reasons: string[] = [];
  const criterion = chshCriterion(chsh, profile, general);
  if (criterion.value !== null && !criterion.passes) {
    const source = profile.securityModel === 'general' && general ? 'ω_thr of the general-attack protocol' : `ω_Q − ${profile.chshTolerance}`;
    reasons.push(`The ${criterion.name} ${criterion.value.toFixed(6)} is below the threshold ${criterion.threshold.toFixed(6)} (${source}).`);
  }
  const lower = chsh.winFractionLower;
  const at = `at ε = ${profile.epsilon}`;
  if (lower === null || lower <= LOCAL_WIN_FRACTION) {
    reasons.push(
      `The lower bound of the CHSH win fraction, ${lower === null ? 'unknown' : lower.toFixed(6)} ${at}, is not above the local bound 0.75: these rounds show no significant Bell violation.`,
    );
  } else if (lower > QUANTUM_WIN_FRACTION) {
    reasons.push(
      `The lower bound of the CHSH win fraction, ${lower.toFixed(6)} ${at} (S ≥ ${chshValueFromWinFraction(lower).toFixed(4)}), is above the quantum maximum ${QUANTUM_WIN_FRACTION.toFixed(6)} (S = 2√2): no quantum device does that, so the data or its analysis is broken.`,
    );
  }
  return reasons;
}

/** A criterion as judged: the value the profile judges on, its threshold, and whether it passes. */
export interface CriterionJudgement {
  name: string;
  value: number | null;
  threshold: number;
  passes: boolean;
}

/**
 * The CHSH criterion on the balanced win fraction (or its lower bound, `certified`) against
 * ω_Q − chshTolerance. Under the general-attack model the protocol's own acceptance count holds
 * instead: the lost CHSH test rounds L may be at most n′·γ′·(1 − ω_thr) (Nadlinger et al., Nature
 * 607, 682 (2022), Supplementary Proposition 2), written as the score 1 − L/(n′·γ′) ≥ ω_thr. L
 * counts the missing test rounds and is the larger of the pooled losses and the losses at the
 * balanced win fraction, so unequal setting shares cannot lower it.
 */
export function chshCriterion(chsh: ChshSummary, profile: AnalysisProfile, general?: GeneralAcceptance | null): CriterionJudgement {
  if (profile.securityModel === 'general' && general) {
    const expectedTests = general.rounds * general.testProbability;
    const played = chsh.rounds + chsh.missingTestRounds;
    const lost = Math.max(played - chsh.wins, chsh.winFraction === null ? played : played * (1 - chsh.winFraction));
    const value = expectedTests > 0 ? 1 - lost / expectedTests : null;
    return {
      name: 'CHSH score of the acceptance count (1 − lost / expected test rounds)',
      value,
      threshold: general.omegaThreshold,
      passes: value !== null && value >= general.omegaThreshold,
    };
  }
  const certified = profile.criterion === 'certified';
  const threshold = QUANTUM_WIN_FRACTION - profile.chshTolerance;
  const value = certified ? chsh.winFractionLower : chsh.winFraction;
  return { name: certified ? 'lower bound of the CHSH win fraction' : 'CHSH win fraction', value, threshold, passes: value !== null && value >= threshold };
}

/** The error-rate criterion: the rate (or its upper bound, `certified`) at most qberTolerance. */
export function qberCriterion(qber: QberSummary, profile: AnalysisProfile): CriterionJudgement {
  const certified = profile.criterion === 'certified';
  const value = certified ? qber.rateUpper : qber.rate;
  return { name: certified ? 'upper bound of the error rate' : 'error rate', value, threshold: profile.qberTolerance, passes: value !== null && value <= profile.qberTolerance };
}
