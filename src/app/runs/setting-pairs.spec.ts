import { COUNT_CELLS, countCell, summariseChsh } from '@shared/analysis';
import { settingPairsTable } from './setting-pairs';

const THIN = '\u2009';

/** A flat count table from rounds per (x, y, a, b). */
function table(cells: Array<[x: number, y: number, a: number, b: number, rounds: number]>): number[] {
  const flat = new Array<number>(COUNT_CELLS).fill(0);
  for (const [x, y, a, b, rounds] of cells) flat[countCell(x, y, a, b)] += rounds;
  return flat;
}

// Pair (0, 1) is won less often and tested half as often as the others: the pooled fraction
// (2920/3500 = 0.8343) then sits above the balanced one ((0.85 + 0.80 + 0.84 + 0.83)/4 = 0.83).
const test = table([
  [0, 0, 0, 0, 850],
  [0, 0, 0, 1, 150],
  [0, 1, 1, 1, 400],
  [0, 1, 1, 0, 100],
  [1, 0, 0, 0, 840],
  [1, 0, 1, 0, 160],
  [1, 1, 0, 1, 830],
  [1, 1, 1, 1, 170],
]);
const generation = table([
  [0, 0, 0, 0, 9000],
  [0, 1, 0, 0, 9500],
  [1, 0, 0, 0, 9000],
  [1, 1, 0, 0, 8000],
  [0, 2, 0, 0, 50000],
]);

describe('settingPairsTable', () => {
  const chsh = summariseChsh(test, generation, 1e-9);
  const pairs = settingPairsTable(chsh)!;

  it('lists the four pairs in order with their rounds in the log, test rounds and wins', () => {
    expect(pairs.rows.map((row) => `${row.x}${row.y}`)).toEqual(['00', '01', '10', '11']);
    expect(pairs.rows[0]).toMatchObject({ rounds: `10${THIN}000`, testRounds: `1${THIN}000`, wins: '850', winFraction: '0.8500' });
    // (1, 1) is won when the outcomes differ.
    expect(pairs.rows[3]).toMatchObject({ rounds: `9${THIN}000`, testRounds: `1${THIN}000`, wins: '830', winFraction: '0.8300' });
  });

  it('gives each pair its own Hoeffding bound, sqrt(ln(1/ε)/(2n)) below its fraction', () => {
    // 0.85 − sqrt(ln 1e9 / 2000) = 0.748208 and 0.80 − sqrt(ln 1e9 / 1000) = 0.656044 (worked by hand).
    expect(pairs.rows[0].winFractionLower).toBe('≥ 0.7482');
    expect(pairs.rows[1].winFractionLower).toBe('≥ 0.6560');
  });

  it('puts the balanced fraction judged beside the pooled one kept for reference', () => {
    expect(pairs.balanced).toBe('0.8300');
    expect(pairs.pooled).toBe('0.8343');
    expect(pairs.balancedLower).toMatch(/^≥ 0\.\d{4}$/);
    expect(Number(pairs.balancedLower.slice(2))).toBeLessThan(0.83);
    expect(pairs.totals).toEqual({ rounds: `39${THIN}000`, testRounds: `3${THIN}500`, wins: `2${THIN}920` });
    expect(pairs.missingNote).toBe('');
  });

  it('says how many missing test rounds were counted as lost', () => {
    expect(settingPairsTable(summariseChsh(test, generation, 1e-9, 1))!.missingNote).toBe(
      '1 missing round was drawn for testing and counts as lost in the balanced figure, where it lowers it most.',
    );
    expect(settingPairsTable(summariseChsh(test, generation, 1e-9, 12))!.missingNote).toMatch(/^12 missing rounds were drawn for testing and count as lost/);
  });

  it('shows an en dash for a pair without test rounds', () => {
    const untested = summariseChsh(
      table([
        [0, 0, 0, 0, 10],
        [0, 1, 0, 0, 10],
        [1, 0, 0, 0, 10],
      ]),
      generation,
      1e-9,
    );
    const rows = settingPairsTable(untested)!;
    expect(rows.rows[3]).toMatchObject({ testRounds: '0', winFraction: '–', winFractionLower: '–' });
    expect(rows.balanced).toBe('–');
  });

  it('leaves the table out for a result stored before per-pair figures', () => {
    const { pairs: _dropped, ...older } = chsh;
    expect(settingPairsTable(older as typeof chsh)).toBeNull();
  });
});
