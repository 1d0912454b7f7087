import { BlockSummary, FractionInterval } from '../report/block-summary';
import { chiSquaredIndependence } from '../statistics/independence-test';
import { CheckFinding, statisticalFinding } from './check-result';

/** Statistical checks this file makes: the win fraction and the error rate. */
export const STATIONARITY_CHECKS = 2;

/**
 * Stationarity: a chi-squared homogeneity test (Pearson 1900) of the per-block CHSH win fraction
 * and of the per-block error rate, the blocks being consecutive stretches of rounds. Drifting
 * devices break the i.i.d. assumption behind the collective-attack figures, so under that model a
 * failure blocks ACCEPT (the caller makes the family blocking); under the general model it warns.
 */
export function stationarityChecks(blocks: readonly BlockSummary[], significance: number): CheckFinding[] {
  return [
    homogeneity(
      'stationarity-chsh',
      'CHSH win fraction',
      blocks.map((block) => block.chsh),
      significance,
    ),
    homogeneity(
      'stationarity-qber',
      'error rate on the key setting',
      blocks.map((block) => block.qber),
      significance,
    ),
  ];
}

function homogeneity(id: string, what: string, parts: readonly FractionInterval[], significance: number): CheckFinding {
  const test = chiSquaredIndependence(parts.map((part) => [part.hits, part.rounds - part.hits]));
  return statisticalFinding(
    { id, family: 'stationarity' },
    test.log10PValue,
    significance,
    (holds, p) =>
      `The ${what} is ${holds ? 'steady' : 'not steady'} across ${parts.length} blocks (homogeneity chi-squared ${test.statistic.toFixed(2)}, ${test.degreesOfFreedom} dof, p = ${p}).`,
  );
}
