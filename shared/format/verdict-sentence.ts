import type { KeySummary } from '../analysis/report/key-summary';
import type { SecuritySummary } from '../analysis/report/security-summary';
import type { Verdict } from '../analysis/result';

/** What of a result says which key counts and how many bits it has. */
export interface KeyOfResult {
  key: Pick<KeySummary, 'finiteKeyBits' | 'generalAttackBits'> | null;
  security: Pick<SecuritySummary, 'model'> | null;
}

/** The key bits that count for a result: the figure of the profile's attack model (see SecuritySummary); null without one. */
export function keyBitsThatCount(result: KeyOfResult): number | null {
  if (result.key === null) return null;
  return result.security?.model === 'general' ? result.key.generalAttackBits : result.key.finiteKeyBits;
}

/**
 * The sentence that says what a verdict means, the same under the word in the app, the mail and
 * the PDF. An ACCEPT whose counting key figure is 0 bits says that the criteria hold but no key can
 * be extracted at this size; INVALID says that no verdict was possible, and for two station logs
 * whether their records were shifted against each other.
 */
export function verdictSentence(result: KeyOfResult & { verdict: Verdict; errorCount?: number; stations?: { alignment: { shifted: boolean } | null } }): string {
  switch (result.verdict) {
    case 'ACCEPT':
      return keyBitsThatCount(result) === 0
        ? 'Every acceptance criterion holds and no test that aborts a run failed, but no key can be extracted from a run of this size: none is kept.'
        : 'Every acceptance criterion holds and no test that aborts a run failed: the raw key of this run may be kept.';
    case 'ABORT':
      return 'The run failed its tests: no key may be kept from it.';
    case 'INVALID':
      if (result.stations?.alignment?.shifted) {
        return "No verdict was possible: the two stations' records are shifted against each other, so no round was tested; a shift lead may re-run the night at a stated offset.";
      }
      if (result.stations && result.errorCount === 0)
        return 'No verdict was possible: the two station logs could not be judged as they stand (see why below), so no round was tested.';
      return 'No verdict was possible: the log could not be read as a round log, so no round was tested.';
  }
}
