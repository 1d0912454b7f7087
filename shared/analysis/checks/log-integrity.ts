import { formatCount } from '../../format/numbers';
import { MissingRoundsSummary, missingShareText } from '../report/missing-rounds';
import { CheckFinding } from './check-result';

/**
 * Missing rounds (the detection and post-selection loopholes: a local model that may leave rounds
 * out of its log can show any S up to 4 on the rest; Pearle, PRD 2, 1418 (1970); Garg and Mermin,
 * PRD 35, 3831 (1987); Eberhard, PRA 47, R747 (1993); Larsson, PRA 57, 3304 (1998); Larsson and
 * Gill, Europhys. Lett. 67, 707 (2004)). The round column is the stations' trigger counter; every
 * index between the first and the last that the log lacks is a missing round. Each missing round
 * drawn for testing already counts as a lost CHSH game; beyond that the profile's tolerance caps how
 * many may be missing at all, and a log past it never passes, whatever the profile's blocking families.
 */
export function logIntegrityCheck(rounds: number, span: MissingRoundsSummary): CheckFinding {
  const { missing, tolerated: allowed, drawnForTesting } = span;
  const holds = missing <= allowed;
  const where = `${formatCount(rounds)} rounds with round indices ${formatCount(span.firstRound)} to ${formatCount(span.lastRound)}`;
  const drawn = drawnForTesting > 0 ? ` ${formatCount(drawnForTesting)} of them were drawn for testing and count as lost CHSH games.` : '';
  const share = missingShareText(span);
  return {
    id: 'log-integrity',
    family: 'log-integrity',
    holds,
    alwaysBlocks: true,
    observed: missing,
    threshold: allowed,
    message:
      missing === 0
        ? `${where}, strictly increasing with none missing.`
        : `${where}: ${formatCount(missing)} of the ${formatCount(span.triggers)} triggers are missing (${share}); the profile tolerates ${formatCount(allowed)}${holds ? '' : ', so the log cannot be trusted to hold every round'}.${drawn}`,
  };
}
