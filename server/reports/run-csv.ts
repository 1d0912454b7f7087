import { stringify } from 'csv-stringify/sync';
import type { AnalysisResult } from '@shared/analysis';

/**
 * The count tables as CSV: one row per subset (test, generation) and cell (x, y, a, b), so a
 * spreadsheet can pivot them. Outcomes are the engine's 0/1 after the column mapping.
 */
export function countsCsv(result: AnalysisResult): string {
  const rows: (string | number)[][] = [];
  for (const subset of ['test', 'generation'] as const) {
    const table = result.counts?.[subset];
    if (!table) continue;
    table.forEach((byY, x) => byY.forEach((byA, y) => byA.forEach((byB, a) => byB.forEach((count, b) => rows.push([subset, x, y, a, b, count])))));
  }
  return stringify(rows, { header: true, columns: ['subset', 'x', 'y', 'a', 'b', 'rounds'] });
}

/** The drift blocks as CSV: per block, its rounds and the win fraction and QBER with their Hoeffding intervals. */
export function blocksCsv(result: AnalysisResult): string {
  const rows = result.blocks.map((block) => [
    block.index,
    block.firstRound,
    block.lastRound,
    block.chsh.rounds,
    block.chsh.hits,
    block.chsh.fraction,
    block.chsh.lower,
    block.chsh.upper,
    block.qber.rounds,
    block.qber.hits,
    block.qber.fraction,
    block.qber.lower,
    block.qber.upper,
  ]);
  return stringify(rows, {
    header: true,
    columns: [
      'block',
      'first_round',
      'last_round',
      'chsh_test_rounds',
      'chsh_wins',
      'win_fraction',
      'win_fraction_lower',
      'win_fraction_upper',
      'key_test_rounds',
      'key_errors',
      'qber',
      'qber_lower',
      'qber_upper',
    ],
    // Doubles as JavaScript writes them: the shortest text that reads back to the same bits.
    cast: { number: (value) => String(value) },
  });
}
