import { chiSquaredGoodnessOfFit, ChiSquaredTest } from '../statistics/goodness-of-fit';
import { countCell } from '../tally/count-table';
import { CheckFinding, statisticalFinding } from './check-result';

/** Rounds per setting pair (x, y) of a count table, in the order (0,0) (0,1) (0,2) (1,0) (1,1) (1,2). */
export function settingPairCounts(table: readonly number[]): number[] {
  const pairs: number[] = [];
  for (let x = 0; x < 2; x++) {
    for (let y = 0; y < 3; y++) {
      pairs.push([0, 1].reduce((sum, a) => sum + table[countCell(x, y, a, 0)] + table[countCell(x, y, a, 1)], 0));
    }
  }
  return pairs;
}

/** Statistical checks this file makes: x, y and (x, y) over all rounds, (x, y) over the test rounds. */
export const SETTING_UNIFORMITY_CHECKS = 4;

/**
 * Setting uniformity: chi-squared goodness of fit (Pearson 1900) of A's setting x against 1/2 each,
 * B's setting y against 1/3 each, and the pair (x, y) against 1/6 each, over all rounds; and of the
 * pair (x, y) over the test rounds alone, since a test set that holds some pairs more often than the
 * design is what lets a local strategy look better than it is. A biased setting generator voids
 * the analysis.
 */
export function settingUniformityChecks(all: readonly number[], test: readonly number[], significance: number): CheckFinding[] {
  const pairs = settingPairCounts(all);
  const xCounts = [pairs[0] + pairs[1] + pairs[2], pairs[3] + pairs[4] + pairs[5]];
  const yCounts = [pairs[0] + pairs[3], pairs[1] + pairs[4], pairs[2] + pairs[5]];
  const sixths = pairs.map(() => 1 / 6);
  return [
    finding('setting-uniformity-x', "station A's setting x", chiSquaredGoodnessOfFit(xCounts, [1 / 2, 1 / 2]), 'uniform over 0, 1', significance),
    finding('setting-uniformity-y', "station B's setting y", chiSquaredGoodnessOfFit(yCounts, [1 / 3, 1 / 3, 1 / 3]), 'uniform over 0, 1, 2', significance),
    finding('setting-uniformity-joint', 'the setting pair (x, y)', chiSquaredGoodnessOfFit(pairs, sixths), 'uniform over the six pairs', significance),
    finding(
      'setting-uniformity-test',
      'the setting pair (x, y) of the test rounds',
      chiSquaredGoodnessOfFit(settingPairCounts(test), sixths),
      'uniform over the six pairs',
      significance,
    ),
  ];
}

function finding(id: string, what: string, test: ChiSquaredTest, expectation: string, significance: number): CheckFinding {
  return statisticalFinding(
    { id, family: 'setting-uniformity' },
    test.log10PValue,
    significance,
    (holds, p) =>
      `${capitalise(what)} is ${holds ? 'consistent with' : 'not consistent with'} ${expectation} (chi-squared ${test.statistic.toFixed(2)}, ${test.degreesOfFreedom} dof, p = ${p}).`,
  );
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
