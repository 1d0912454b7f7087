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
  const certified = profile.criterion === 'certified';
  const winThreshold = QUANTUM_WIN_FRACTION - profile.chshTolerance;
  const win = certified ? chsh.winFractionLower : chsh.winFraction;
  const winName = certified ? 'lower bound of the CHSH win fraction' : 'CHSH win fraction';
  if (win === null) {
    reasons.push('There are no CHSH test rounds.');
  } else if (win < winThreshold) {
    reasons.push(`The ${winName} ${win.toFixed(6)} is below the threshold ${winThreshold.toFixed(6)} (ω_Q − ${profile.chshTolerance}).`);
  }
  const rate = certified ? qber.rateUpper : qber.rate;
  const rateName = certified ? 'upper bound of the error rate' : 'error rate';
  if (rate === null) {
    reasons.push('There are no key-setting test rounds.');
  } else if (rate > profile.qberTolerance) {
    reasons.push(`The ${rateName} on the key setting ${rate.toFixed(6)} is above the tolerance ${profile.qberTolerance}.`);
  }
  for (const check of checks.filter((c) => c.status === 'fail')) {
    reasons.push(`Check ${check.id} failed: ${check.message}`);
  }
  if (profile.requirePositiveKey && key.finiteKeyBits <= 0) {
    reasons.push('The finite key length is not positive, and the profile requires a key.');
  }
  return { verdict: reasons.length === 0 ? 'ACCEPT' : 'ABORT', reasons };
}
