import { chiSquaredIndependence } from '../statistics/independence-test';
import { upperTail } from '../statistics/goodness-of-fit';
import { countCell } from '../tally/count-table';
import { CheckFinding, formatPValue } from './check-result';

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
  const statistic = tests.reduce((sum, test) => sum + test.statistic, 0);
  const degreesOfFreedom = tests.reduce((sum, test) => sum + test.degreesOfFreedom, 0);
  const pValue = degreesOfFreedom === 0 ? 1 : upperTail(statistic, degreesOfFreedom);
  const holds = pValue >= significance;
  return {
    id,
    family: 'no-signalling',
    holds,
    observed: pValue,
    threshold: significance,
    message: `${outcome} ${holds ? 'shows no dependence' : 'depends'} on ${setting} (chi-squared ${statistic.toFixed(2)}, ${degreesOfFreedom} dof, p = ${formatPValue(pValue)}).`,
  };
}
