import { chiSquaredGoodnessOfFit, ChiSquaredTest } from '../statistics/goodness-of-fit';
import { countCell } from '../tally/count-table';
import { CheckFinding, formatPValue } from './check-result';

/** Rounds per setting pair (x, y), all rounds, in the order (0,0) (0,1) (0,2) (1,0) (1,1) (1,2). */
export function settingPairCounts(all: readonly number[]): number[] {
  const pairs: number[] = [];
  for (let x = 0; x < 2; x++) {
    for (let y = 0; y < 3; y++) {
      pairs.push([0, 1].reduce((sum, a) => sum + all[countCell(x, y, a, 0)] + all[countCell(x, y, a, 1)], 0));
    }
  }
  return pairs;
}

/**
 * Setting uniformity: chi-squared goodness of fit (Pearson 1900) of A's setting x against 1/2 each,
 * B's setting y against 1/3 each, and the pair (x, y) against 1/6 each, over all rounds. A biased
 * setting generator voids the analysis.
 */
export function settingUniformityChecks(all: readonly number[], significance: number): CheckFinding[] {
  const pairs = settingPairCounts(all);
  const xCounts = [pairs[0] + pairs[1] + pairs[2], pairs[3] + pairs[4] + pairs[5]];
  const yCounts = [pairs[0] + pairs[3], pairs[1] + pairs[4], pairs[2] + pairs[5]];
  return [
    finding('setting-uniformity-x', "station A's setting x", chiSquaredGoodnessOfFit(xCounts, [1 / 2, 1 / 2]), 'uniform over 0, 1', significance),
    finding('setting-uniformity-y', "station B's setting y", chiSquaredGoodnessOfFit(yCounts, [1 / 3, 1 / 3, 1 / 3]), 'uniform over 0, 1, 2', significance),
    finding('setting-uniformity-joint', 'the setting pair (x, y)', chiSquaredGoodnessOfFit(pairs, pairs.map(() => 1 / 6)), 'uniform over the six pairs', significance),
  ];
}

function finding(id: string, what: string, test: ChiSquaredTest, expectation: string, significance: number): CheckFinding {
  const holds = test.pValue >= significance;
  const verdict = holds ? 'consistent with' : 'not consistent with';
  return {
    id,
    family: 'setting-uniformity',
    holds,
    observed: test.pValue,
    threshold: significance,
    message: `${capitalise(what)} is ${verdict} ${expectation} (chi-squared ${test.statistic.toFixed(2)}, ${test.degreesOfFreedom} dof, p = ${formatPValue(test.pValue)}).`,
  };
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
