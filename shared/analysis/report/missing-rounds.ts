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

/** The state of a log's missing rounds, as a word (never shown by colour alone). */
export type MissingRoundsState = 'None missing' | 'Within tolerance' | 'Over tolerance';

/** The state of the missing rounds against the profile's tolerance. */
export function missingRoundsState(summary: MissingRoundsSummary): MissingRoundsState {
  return summary.missing > summary.tolerated ? 'Over tolerance' : summary.missing > 0 ? 'Within tolerance' : 'None missing';
}

/**
 * The missing rounds' share of the triggers in per cent, two significant digits ("0.17 %"): a
 * handful of missing rounds among millions of triggers must not read "0.00 %".
 */
export function missingShareText(summary: Pick<MissingRoundsSummary, 'missing' | 'triggers'>): string {
  return shareText(summary.missing, summary.triggers);
}

/** `part` of `whole` in per cent, two significant digits ("0.17 %"), whole per cents from 99.5 up ("100 %"); "0 %" when either is 0. */
export function shareText(part: number, whole: number): string {
  const percent = (100 * part) / whole;
  const share = part === 0 || whole === 0 ? '0' : percent >= 99.5 ? percent.toFixed(0) : percent.toPrecision(2);
  return `${share}\u2009%`;
}
