import { TriggerSpan } from '../log/range-plans';

/** The rounds a log lacks between its first and last round index. */
export interface MissingRoundsSummary {
  /** First and last round index of the log. */
  firstRound: number;
  lastRound: number;
  /** Triggers in that span, lastRound − firstRound + 1. */
  triggers: number;
  /** Round indices in the span the log does not hold. */
  missing: number;
  /** Missing rounds drawn for testing (all of them with the log's own marking), each counted as a lost CHSH game. */
  drawnForTesting: number;
  /** Most missing rounds the profile tolerates, ⌊tolerance·triggers⌋. */
  tolerated: number;
}

/** The missing-rounds figures of a read log. */
export function summariseMissingRounds(span: TriggerSpan, missing: number, drawnForTesting: number, tolerance: number): MissingRoundsSummary {
  return { firstRound: span.firstRound, lastRound: span.lastRound, triggers: span.triggers, missing, drawnForTesting, tolerated: Math.floor(tolerance * span.triggers) };
}
