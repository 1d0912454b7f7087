import type { ChshSummary } from '@shared/analysis';
import { formatCount, formatFixed } from '@shared/format/numbers';

/** One CHSH setting pair (x, y) as the run page lists it, every figure formatted. */
export interface SettingPairRow {
  readonly x: 0 | 1;
  readonly y: 0 | 1;
  /** Rounds of the pair in the log, tested or not. */
  readonly rounds: string;
  readonly testRounds: string;
  readonly wins: string;
  readonly winFraction: string;
  /** The pair's own Hoeffding lower bound, with its sign: `≥ 0.8123`. */
  readonly winFractionLower: string;
}

/** The CHSH setting pairs of a run: a row per pair, then the balanced figure judged and the pooled one beside it. */
export interface SettingPairsTable {
  readonly rows: readonly SettingPairRow[];
  /** All four pairs' rounds, test rounds and wins added up. */
  readonly totals: { readonly rounds: string; readonly testRounds: string; readonly wins: string };
  /** The win fraction with the four pairs weighed equally: the one the verdict uses. */
  readonly balanced: string;
  readonly balancedLower: string;
  /** wins / test rounds over all pairs, for reference only. */
  readonly pooled: string;
  /** Missing test rounds counted as lost games in the balanced figure, in words; empty when none. */
  readonly missingNote: string;
}

/**
 * The rows of the "CHSH by setting pair" table, or null for a result without per-pair figures
 * (stored by an engine before 2.0).
 */
export function settingPairsTable(chsh: ChshSummary): SettingPairsTable | null {
  // Results stored before engine 2.0 have no `pairs`: the page then leaves the table out.
  const pairs = chsh.pairs ?? [];
  if (pairs.length === 0) return null;
  const total = (pick: (pair: ChshSummary['pairs'][number]) => number) => formatCount(pairs.reduce((sum, pair) => sum + pick(pair), 0));
  const missing = chsh.missingTestRounds ?? 0;
  return {
    rows: pairs.map((pair) => ({
      x: pair.x,
      y: pair.y,
      rounds: formatCount(pair.rounds),
      testRounds: formatCount(pair.testRounds),
      wins: formatCount(pair.wins),
      winFraction: formatFixed(pair.winFraction),
      winFractionLower: bound(pair.winFractionLower),
    })),
    totals: { rounds: total((pair) => pair.rounds), testRounds: total((pair) => pair.testRounds), wins: total((pair) => pair.wins) },
    balanced: formatFixed(chsh.winFraction),
    balancedLower: bound(chsh.winFractionLower),
    pooled: formatFixed(chsh.pooledWinFraction),
    missingNote:
      missing === 0
        ? ''
        : `${formatCount(missing)} missing ${missing === 1 ? 'round was' : 'rounds were'} drawn for testing and ${missing === 1 ? 'counts' : 'count'} as lost in the balanced figure, where ${missing === 1 ? 'it lowers' : 'they lower'} it most.`,
  };
}

function bound(lower: number | null): string {
  return lower === null ? '–' : `≥ ${formatFixed(lower)}`;
}
