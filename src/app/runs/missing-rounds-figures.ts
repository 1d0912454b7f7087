import type { MissingRoundsSummary } from '../../../shared/analysis/report/missing-rounds';
import { formatCount } from '../../../shared/format/numbers';

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
  readonly word: 'None missing' | 'Within tolerance' | 'Over tolerance';
  readonly icon: 'check_circle' | 'info' | 'warning';
}

/** Thin space between a figure and its unit, as in `formatPercent`. */
const THIN_SPACE = '\u2009';

/** The missing-rounds figures of a result, or null when it has none (an INVALID log, or an engine before 2.0). */
export function missingRoundsFigures(summary: MissingRoundsSummary | null | undefined): MissingRoundsFigures | null {
  if (!summary) return null;
  const { firstRound, lastRound, triggers, missing, tolerated, drawnForTesting } = summary;
  return {
    span: `${formatCount(firstRound)} to ${formatCount(lastRound)}`,
    triggers: formatCount(triggers),
    missing: formatCount(missing),
    share: `${shareOf(missing, triggers)}${THIN_SPACE}%`,
    tolerated: formatCount(tolerated),
    drawnForTesting: formatCount(drawnForTesting),
    overTolerance: missing > tolerated,
    anyMissing: missing > 0,
    ...(missing > tolerated
      ? { word: 'Over tolerance', icon: 'warning' }
      : missing > 0
        ? { word: 'Within tolerance', icon: 'info' }
        : { word: 'None missing', icon: 'check_circle' }),
  };
}

// Two significant digits, as the log-integrity check words it: a handful of missing rounds among
// millions of triggers must not read "0.00 %".
function shareOf(missing: number, triggers: number): string {
  if (missing === 0 || triggers === 0) return '0';
  return ((100 * missing) / triggers).toPrecision(2);
}
