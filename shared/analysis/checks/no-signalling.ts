import { chiSquaredIndependence } from '../statistics/independence-test';
import { chiSquaredTest } from '../statistics/goodness-of-fit';
import { countCell } from '../tally/count-table';
import { CheckFinding, statisticalFinding } from './check-result';

/** Statistical checks this file makes: one per station. */
export const NO_SIGNALLING_CHECKS = 2;

/**
 * No-signalling: A's outcome a must not depend on B's setting y (for each x), nor B's outcome b on
 * A's setting x (for each y). Each setting gives a chi-squared test of independence (Pearson 1900);
 * the tables hold disjoint rounds, so their statistics and degrees of freedom add up to one test per
 * station (the sum of independent chi-squared variables is chi-squared).
 */
export function noSignallingChecks(all: readonly number[], significance: number): CheckFinding[] {
  const aTables = [0, 1].map((x) => [0, 1, 2].map((y) => [0, 1].map((a) => all[countCell(x, y, a, 0)] + all[countCell(x, y, a, 1)])));
  const bTables = [0, 1, 2].map((y) => [0, 1].map((x) => [0, 1].map((b) => all[countCell(x, y, 0, b)] + all[countCell(x, y, 1, b)])));
  return [
    combined('no-signalling-a', "Station A's outcome", "station B's setting", aTables, significance),
    combined('no-signalling-b', "Station B's outcome", "station A's setting", bTables, significance),
  ];
}

function combined(id: string, outcome: string, setting: string, tables: number[][][], significance: number): CheckFinding {
  const tests = tables.map((table) => chiSquaredIndependence(table));
  const test = chiSquaredTest(
    tests.reduce((sum, one) => sum + one.statistic, 0),
    tests.reduce((sum, one) => sum + one.degreesOfFreedom, 0),
  );
  return statisticalFinding(
    { id, family: 'no-signalling' },
    test.log10PValue,
    significance,
    (holds, p) => `${outcome} ${holds ? 'shows no dependence' : 'depends'} on ${setting} (chi-squared ${test.statistic.toFixed(2)}, ${test.degreesOfFreedom} dof, p = ${p}).`,
  );
}
