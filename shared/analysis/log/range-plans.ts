import { AnalysisProfile } from '../profile';
import { KeystreamSource } from '../selection/keystream';
import { fixedFractionTests, testsBeforeRounds } from '../selection/test-selector';
import { HeaderLayout } from './header-layout';
import { LineCount } from './line-counter';
import { RangePlan } from './range-analysis';

/** Line number of the first data line: the header is line 1. */
export const FIRST_DATA_LINE = 2;

/**
 * The analysis plan of each stretch from the counting pass: its first line, its first round index,
 * and for fixed-fraction selection the test rounds chosen before it (by running the selection over
 * the keystream alone), so every stretch decides exactly as one reader of the whole log would.
 */
export function planRanges(layout: HeaderLayout, profile: AnalysisProfile, counts: readonly LineCount[], keystream: KeystreamSource | null): RangePlan[] {
  const totalRounds = counts.reduce((sum, count) => sum + count.records, 0);
  const selection = profile.testSelection;
  const totalTests = selection.mode === 'fixed-fraction' ? fixedFractionTests(selection.fraction, totalRounds) : 0;
  const firstRounds: number[] = [];
  const firstLines: number[] = [];
  counts.reduce(
    (at, count) => {
      firstRounds.push(at.round);
      firstLines.push(at.line);
      return { round: at.round + count.records, line: at.line + count.lines };
    },
    { round: 0, line: FIRST_DATA_LINE },
  );
  const testsBefore =
    selection.mode === 'fixed-fraction' && keystream !== null && counts.length > 1
      ? testsBeforeRounds(keystream, totalRounds, totalTests, firstRounds)
      : firstRounds.map(() => 0);
  return counts.map((_, i) => ({
    layout,
    selection,
    firstLine: firstLines[i],
    start: { firstRound: firstRounds[i], totalRounds, totalTests, testsBefore: testsBefore[i] },
    blocks: profile.driftBlocks,
  }));
}
