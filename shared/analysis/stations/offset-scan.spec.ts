import { OFFSET_REACH, OffsetScanOptions, scanOffsets } from './offset-scan';
import { StationRow } from './station-row';
import { stationBatches } from './testing/station-batches';

const row = (round: number, setting: number, outcome: number): StationRow => ({ round, setting, outcome, settingTime: null, outcomeTime: null });

/** n mod 2, 0 or 1 for negative n too (B's rounds before A's first pair with A's rounds below 0). */
const parity = (n: number) => n & 1;

/** A's round r: x = r mod 2, a = ⌊r/4⌋ mod 2. */
const rowA = (r: number) => row(r, parity(r), parity(r >> 2));
/** B's setting at its round s: y = ⌊s/2⌋ mod 2, so (x_r, y_r+2) runs through all four pairs every four rounds. */
const settingB = (s: number) => parity(s >> 1);

/**
 * B's record made to win every CHSH game with A's round r at its own round r + shift:
 * b = a ⊕ x·y, so E00 = E01 = E10 = 1, E11 = −1 and S = 4 exactly there.
 */
function recordB(rounds: readonly number[], shift: number): StationRow[] {
  return rounds.map((s) => {
    const a = rowA(s - shift);
    const y = settingB(s);
    return row(s, y, a.outcome ^ (a.setting * y));
  });
}

const batches = (rows: readonly StationRow[], size = 5) => stationBatches(rows, size);

const range = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, i) => from + i);

async function scan(a: readonly StationRow[], b: readonly StationRow[], options: OffsetScanOptions = {}) {
  return scanOffsets(batches(a), batches(b, 3), options);
}

describe('scanOffsets', () => {
  it("finds S = 4 exactly at the offset k where A's round r meets B's round r + k", async () => {
    const result = await scan(range(0, 99).map(rowA), recordB(range(0, 101), 2));
    expect(result.fits.map((fit) => fit.offset)).toEqual(range(-OFFSET_REACH, OFFSET_REACH));
    const atTwo = result.fits.find((fit) => fit.offset === 2);
    expect(atTwo).toEqual({ offset: 2, settingPairRounds: [25, 25, 25, 25], correlators: { E00: 1, E01: 1, E10: 1, E11: -1 }, chshValue: 4 });
    expect(result.fits.find((fit) => fit.offset === -2)?.chshValue).not.toBe(4);
    expect(result.roundsRead).toBe(100);
  });

  it('pairs by round index, so a gap shifts nothing, and counts only the rounds both have', async () => {
    const a = range(0, 99)
      .filter((r) => r !== 40)
      .map(rowA);
    const b = recordB(
      range(0, 101).filter((s) => s !== 70),
      2,
    );
    const atTwo = (await scan(a, b)).fits.find((fit) => fit.offset === 2);
    // A's 40 and B's 42 (A's 40 + 2) are one lost pair, B's 70 (A's 68) another: 100 − 2.
    expect(atTwo?.chshValue).toBe(4);
    expect(atTwo?.settingPairRounds.reduce((sum, m) => sum + m, 0)).toBe(98);
  });

  it('counts every pair within reach once: 100 rounds each give 100 − |k| pairs at offset k', async () => {
    const result = await scan(range(0, 99).map(rowA), recordB(range(0, 99), 0));
    for (const fit of result.fits) {
      expect(fit.settingPairRounds.reduce((sum, m) => sum + m, 0)).toBe(100 - Math.abs(fit.offset));
    }
  });

  it("leaves out B's key-setting rounds (y = 2): they play no CHSH game", async () => {
    const b = recordB(range(0, 19), 0).map((r) => (r.round % 5 === 0 ? { ...r, setting: 2 } : r));
    const atZero = (await scan(range(0, 19).map(rowA), b)).fits.find((fit) => fit.offset === 0);
    expect(atZero?.settingPairRounds.reduce((sum, m) => sum + m, 0)).toBe(16);
  });

  it("reads only A's first rounds of the window, and B's rounds that can meet them", async () => {
    const result = await scan(range(0, 99).map(rowA), recordB(range(0, 99), 0), { windowRounds: 10 });
    expect(result.roundsRead).toBe(10);
    const pairs = (offset: number) => result.fits.find((fit) => fit.offset === offset)?.settingPairRounds.reduce((sum, m) => sum + m, 0);
    // A's rounds 0 … 9 meet B's r + k whenever that is a round of B's (0 … 99).
    expect(pairs(16)).toBe(10);
    expect(pairs(0)).toBe(10);
    expect(pairs(-3)).toBe(7);
  });

  it('centres the scan on a stated offset', async () => {
    const result = await scan(range(0, 99).map(rowA), recordB(range(20, 120), 22), { centre: 20 });
    expect(result.fits[0].offset).toBe(20 - OFFSET_REACH);
    expect(result.fits.find((fit) => fit.offset === 22)?.chshValue).toBe(4);
  });

  it("pairs B's rounds that the centre takes below 0 like any other", async () => {
    const result = await scan(range(0, 99).map(rowA), recordB(range(0, 99), 0), { centre: 5 });
    const atZero = result.fits.find((fit) => fit.offset === 0);
    expect(atZero?.chshValue).toBe(4);
    expect(atZero?.settingPairRounds.reduce((sum, m) => sum + m, 0)).toBe(100);
  });

  it('gives no S where a setting pair has no rounds', async () => {
    const result = await scan([rowA(0)], recordB([0], 0));
    expect(result.fits.find((fit) => fit.offset === 0)).toMatchObject({ settingPairRounds: [1, 0, 0, 0], chshValue: null, correlators: { E00: 1, E01: null } });
  });
});
