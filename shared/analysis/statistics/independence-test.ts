import { ChiSquaredTest, chiSquaredTest } from './goodness-of-fit';

/**
 * Pearson's chi-squared test of independence (or homogeneity) on a contingency table, expected
 * counts from the margins, E_ij = R_i·C_j/N, (r−1)(c−1) degrees of freedom (Pearson 1900; Fisher,
 * J. R. Stat. Soc. 85, 87 (1922) for the degrees of freedom). Empty rows and columns carry no
 * information and are dropped; with fewer than two of either left there is nothing to test (p = 1).
 */
export function chiSquaredIndependence(table: readonly (readonly number[])[]): ChiSquaredTest {
  const columnCount = table[0]?.length ?? 0;
  const columnTotals = Array.from({ length: columnCount }, (_, j) => table.reduce((sum, row) => sum + row[j], 0));
  const keptColumns = columnTotals.map((total, j) => (total > 0 ? j : -1)).filter((j) => j >= 0);
  const keptRows = table.filter((row) => keptColumns.some((j) => row[j] > 0));
  const degreesOfFreedom = (keptRows.length - 1) * (keptColumns.length - 1);
  if (degreesOfFreedom <= 0) {
    return { statistic: 0, degreesOfFreedom: 0, pValue: 1, log10PValue: 0 };
  }
  const total = keptColumns.reduce((sum, j) => sum + columnTotals[j], 0);
  let statistic = 0;
  for (const row of keptRows) {
    const rowTotal = keptColumns.reduce((sum, j) => sum + row[j], 0);
    for (const j of keptColumns) {
      const expected = (rowTotal * columnTotals[j]) / total;
      statistic += (row[j] - expected) ** 2 / expected;
    }
  }
  return chiSquaredTest(statistic, degreesOfFreedom);
}
