import { CheckResult } from '../checks/check-result';
import { AnalysisProfile } from '../profile';
import { QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { Verdict } from '../result';
import { ChshSummary } from './chsh-summary';
import { KeySummary } from './key-summary';
import { QberSummary } from './qber-summary';

/** The verdict on a readable log and the reasons for an abort. */
export interface VerdictFinding {
  verdict: Exclude<Verdict, 'INVALID'>;
  reasons: string[];
}

/**
 * ACCEPT when the CHSH win fraction reaches ω_Q − chshTolerance and the error rate is at most
 * qberTolerance (criterion `observed`: the observed values; `certified`: the Hoeffding-corrected
 * ones), no blocking check failed and, if the profile asks, the finite key is positive; else ABORT.
 */
export function decideVerdict(chsh: ChshSummary, qber: QberSummary, key: KeySummary, checks: readonly CheckResult[], profile: AnalysisProfile): VerdictFinding {
  const reasons: string[] = [];
  const winCriterion = chshCriterion(chsh, profile, key.generalAttack?.omegaThreshold);
  if (winCriterion.value === null) {
    reasons.push('There are no CHSH test rounds.');
  } else if (!winCriterion.passes) {
    const source = profile.securityModel === 'general' && key.generalAttack ? 'ω_thr of the general-attack protocol' : `ω_Q − ${profile.chshTolerance}`;
    reasons.push(`The ${winCriterion.name} ${winCriterion.value.toFixed(6)} is below the threshold ${winCriterion.threshold.toFixed(6)} (${source}).`);
  }
  const rateCriterion = qberCriterion(qber, profile);
  if (rateCriterion.value === null) {
    reasons.push('There are no key-setting test rounds.');
  } else if (!rateCriterion.passes) {
    reasons.push(`The ${rateCriterion.name} on the key setting ${rateCriterion.value.toFixed(6)} is above the tolerance ${profile.qberTolerance}.`);
  }
  for (const check of checks.filter((c) => c.status === 'fail')) {
    reasons.push(`Check ${check.id} failed: ${check.message}`);
  }
  if (profile.requirePositiveKey && profile.securityModel === 'general') {
    if (!key.generalAttackBits) reasons.push(`The key length against general attacks is not positive, and the profile requires a key.${key.generalAttack?.reason ? ` ${key.generalAttack.reason}` : ''}`);
  } else if (profile.requirePositiveKey && key.finiteKeyBits <= 0) {
    reasons.push('The finite key length is not positive, and the profile requires a key.');
  }
  return { verdict: reasons.length === 0 ? 'ACCEPT' : 'ABORT', reasons };
}

/** A criterion as judged: the value the profile judges on, its threshold, and whether it passes. */
export interface CriterionJudgement {
  name: string;
  value: number | null;
  threshold: number;
  passes: boolean;
}

/**
 * The CHSH criterion: the win fraction (or its lower bound, `certified`) at least ω_Q −
 * chshTolerance. Under the general-attack model the protocol fixes its own threshold ω_thr, and
 * the observed win fraction of the test rounds must reach it (Nadlinger et al. 2022: the lost test
 * rounds stay within n·γ·(1 − ω_thr)); its confidence is in the key length instead.
 */
export function chshCriterion(chsh: ChshSummary, profile: AnalysisProfile, generalThreshold?: number): CriterionJudgement {
  if (profile.securityModel === 'general' && generalThreshold !== undefined) {
    return { name: 'CHSH win fraction', value: chsh.winFraction, threshold: generalThreshold, passes: chsh.winFraction !== null && chsh.winFraction >= generalThreshold };
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
