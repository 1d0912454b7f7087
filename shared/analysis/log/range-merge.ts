import { COUNT_CELLS } from '../tally/count-table';
import { BLOCK_ROUNDS, TallyCounts } from '../tally/round-tally';
import { LISTED_PROBLEMS, LogProblem, ProblemList } from './log-problem';
import { recordOrder, RoundMark } from './record-checker';
import { RangeSummary } from './range-analysis';

/**
 * Merges the summaries of consecutive stretches, in log order, into the summary of the whole log:
 * counts add exactly; round order and gaps are checked across each seam, the seam's problem placed
 * after the other problems of its line, as a single reader would have reported it.
 */
export function mergeRanges(ranges: readonly RangeSummary[], blocks: number, roundColumn: string): RangeSummary {
  const problems: LogProblem[] = [];
  let problemCount = 0;
  let gaps = 0;
  let first: RoundMark | null = null;
  let last: RoundMark | null = null;
  for (const range of ranges) {
    const seam = new ProblemList();
    if (last !== null && range.first !== null) {
      recordOrder(last, range.first, seam, roundColumn, (gap) => (gaps += gap));
    }
    const own = [...range.problems];
    if (seam.count > 0) {
      const seamLine = seam.listed[0].line;
      const after = own.findIndex((problem) => problem.line > seamLine);
      own.splice(after < 0 ? own.length : after, 0, ...seam.listed);
    }
    problems.push(...own.slice(0, Math.max(LISTED_PROBLEMS - problems.length, 0)));
    problemCount += range.problemCount + seam.count;
    gaps += range.gaps;
    first ??= range.first;
    last = range.last ?? last;
  }
  return {
    records: sum(ranges, (range) => range.records),
    validRecords: sum(ranges, (range) => range.validRecords),
    testRounds: sum(ranges, (range) => range.testRounds),
    missingTestRounds: sum(ranges, (range) => range.missingTestRounds),
    counts: mergeCounts(
      ranges.map((range) => range.counts),
      blocks,
    ),
    problems,
    problemCount,
    gaps,
    first,
    last,
  };
}

function sum(ranges: readonly RangeSummary[], part: (range: RangeSummary) => number): number {
  return ranges.reduce((total, range) => total + part(range), 0);
}

function mergeCounts(parts: readonly TallyCounts[], blocks: number): TallyCounts {
  const addUp = (pick: (part: TallyCounts) => number[], length: number) => Array.from({ length }, (_, i) => parts.reduce((total, part) => total + pick(part)[i], 0));
  const blockRounds: number[] = new Array<number>(blocks * BLOCK_ROUNDS).fill(NaN);
  for (const part of parts) {
    for (let block = 0; block < blocks; block++) {
      const at = block * BLOCK_ROUNDS;
      if (Number.isNaN(part.blockRounds[at])) {
        continue;
      }
      if (Number.isNaN(blockRounds[at])) {
        blockRounds[at] = part.blockRounds[at];
      }
      blockRounds[at + 1] = part.blockRounds[at + 1];
    }
  }
  return {
    test: addUp((part) => part.test, COUNT_CELLS),
    generation: addUp((part) => part.generation, COUNT_CELLS),
    blockStats: addUp((part) => part.blockStats, parts[0]?.blockStats.length ?? 0),
    blockRounds,
  };
}
