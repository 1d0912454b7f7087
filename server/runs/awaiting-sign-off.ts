import { VERDICT_STATES } from '@shared/api';

/**
 * SQL: run `r` awaits a sign-off. It has a verdict, nobody has signed it off or withdrawn it, and it is its night's
 * current log (a later attempt of the same booking replaced it, and that one is signed off instead).
 * Needs the replacement `:verdictStates` (see {@link AWAITING_SIGN_OFF_REPLACEMENTS}).
 */
export const AWAITING_SIGN_OFF = `r.state IN (:verdictStates)
  AND NOT EXISTS (SELECT 1 FROM run_sign_offs o WHERE o.run_id = r.id)
  AND NOT EXISTS (SELECT 1 FROM run_withdrawals w WHERE w.run_id = r.id)
  AND NOT EXISTS (SELECT 1 FROM runs later WHERE later.booking_id = r.booking_id AND later.attempt > r.attempt)`;

export const AWAITING_SIGN_OFF_REPLACEMENTS = { verdictStates: VERDICT_STATES };
