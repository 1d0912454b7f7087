import type { AnalysisResult, CountTable } from '@shared/analysis';
import { formatCount, formatFixed } from '@shared/format/numbers';
import { grid, paragraph, type GridCell } from './pdf-blocks';
import { TONE } from './pdf-style';

/** The 2×3 setting pairs (x, y): test and generation rounds of each, with its correlator or its role. */
export function writeSettingsTable(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  const { counts, chsh } = result;
  if (counts === null || chsh === null) {
    paragraph(doc, 'No counts: the log could not be analysed.', { colour: TONE.muted });
    return;
  }
  const cell = (x: number, y: number): GridCell => {
    const role = y < 2 ? `E${x}${y} = ${formatFixed(chsh.correlators[`E${x}${y}` as keyof typeof chsh.correlators])}` : x === 0 ? 'key setting' : 'no test, no key';
    return `test ${formatCount(roundsOf(counts.test, x, y))}\ngeneration ${formatCount(roundsOf(counts.generation, x, y))}\n${role}`;
  };
  grid(
    doc,
    [
      { header: 'x \\ y', width: 16 },
      { header: 'y = 0', width: 28, align: 'right' },
      { header: 'y = 1', width: 28, align: 'right' },
      { header: 'y = 2', width: 28, align: 'right' },
    ],
    [0, 1].map((x) => [`x = ${x}`, cell(x, 0), cell(x, 1), cell(x, 2)]),
  );
}

function roundsOf(table: CountTable, x: number, y: number): number {
  return table[x][y].flat().reduce((sum, count) => sum + count, 0);
}
