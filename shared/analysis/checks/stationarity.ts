import { BlockSummary, FractionInterval } from '../report/block-summary';
import { chiSquaredIndependence } from '../statistics/independence-test';
import { CheckFinding, formatPValue } from './check-result';

/**
 * Stationarity: a chi-squared homogeneity test (Pearson 1900) of the per-block CHSH win fraction
 * and of the per-block error rate, the blocks being consecutive stretches of rounds. Drifting
 * devices break the i.i.d. assumption behind the collective-attack figures.
 */
export function stationarityChecks(blocks: readonly BlockSummary[], significance: number): CheckFinding[] {
  return [
    homogeneity('stationarity-chsh', 'CHSH win fraction', blocks.map((block) => block.chsh), significance),
    homogeneity('stationarity-qber', 'error rate on the key setting', blocks.map((block) => block.qber), significance),
  ];
}

function homogeneity(id: string, what: string, parts: readonly FractionInterval[], significance: number): CheckFinding {
  const test = chiSquaredIndependence(parts.map((part) => [part.hits, part.rounds - part.hits]));
  const holds = test.pValue >= significance;
  return {
    id,
    family: 'stationarity',
    holds,
    observed: test.pValue,
    threshold: significance,
    message: `The ${what} is ${holds ? 'steady' : 'not steady'} across ${parts.length} blocks (homogeneity chi-squared ${test.statistic.toFixed(2)}, ${test.degreesOfFreedom} dof, p = ${formatPValue(test.pValue)}).`,
  };
}
