import { missingRoundsState, type MissingRoundsState, type MissingRoundsSummary, missingShareText } from '@shared/analysis';
import { formatCount } from '@shared/format/numbers';

/** The missing-rounds line of a run, every figure formatted. */
export interface MissingRoundsFigures {
  /** First to last round index: `0 to 1 499 999`. */
  readonly span: string;
  readonly triggers: string;
  readonly missing: string;
  /** The missing rounds' share of the triggers, two significant digits: `0.20 %`. */
  readonly share: string;
  readonly tolerated: string;
  readonly drawnForTesting: string;
  /** Whether more rounds are missing than the profile tolerates (the log-integrity check then fails). */
  readonly overTolerance: boolean;
  /** Whether any round is missing at all. */
  readonly anyMissing: boolean;
  /** The word and Material Symbols icon of the state, never shown by colour alone. */
  readonly word: MissingRoundsState;
  readonly icon: 'check_circle' | 'info' | 'warning';
}

/** The icon of each state. */
const STATE_ICON: Record<MissingRoundsState, MissingRoundsFigures['icon']> = { 'None missing': 'check_circle', 'Within tolerance': 'info', 'Over tolerance': 'warning' };

/** The missing-rounds figures of a result, or null when it has none (an INVALID log, or an engine before 2.0). */
export function missingRoundsFigures(summary: MissingRoundsSummary | null | undefined): MissingRoundsFigures | null {
  if (!summary) return null;
  const { firstRound, lastRound, triggers, missing, tolerated, drawnForTesting } = summary;
  return {
    span: `${formatCount(firstRound)} to ${formatCount(lastRound)}`,
    triggers: formatCount(triggers),
    missing: formatCount(missing),
    share: missingShareText(summary),
    tolerated: formatCount(tolerated),
    drawnForTesting: formatCount(drawnForTesting),
    overTolerance: missing > tolerated,
    anyMissing: missing > 0,
    word: missingRoundsState(summary),
    icon: STATE_ICON[missingRoundsState(summary)],
  };
}
