import { decideAlignment } from './alignment-decision';
import { chshValueDeviation } from './chsh-value-deviation';
import { OFFSET_REACH, OffsetFit, OffsetScan } from './offset-scan';

/** A fit with `rounds` CHSH rounds per setting pair and the given S (correlators left out: the rule reads S and the counts). */
const fit = (offset: number, chshValue: number | null, rounds = 250): OffsetFit => ({
  offset,
  settingPairRounds: [rounds, rounds, rounds, rounds],
  correlators: { E00: null, E01: null, E10: null, E11: null },
  chshValue,
});

/** A scan centred on `centre` where every offset has S = 0 but those given. */
function scanWith(values: Record<number, number | null>, centre = 0, rounds = 250): OffsetScan {
  const fits = Array.from({ length: 2 * OFFSET_REACH + 1 }, (_, i) => centre - OFFSET_REACH + i).map((offset) => fit(offset, offset in values ? values[offset] : 0, rounds));
  return { centre, roundsRead: 4 * rounds, windowRounds: 1_000_000, fits };
}

describe('decideAlignment', () => {
  // With 250 rounds per pair and α = 10⁻⁶ over 33 offsets, t = 0.759056 (see chsh-value-deviation.spec.ts).
  const t = chshValueDeviation([250, 250, 250, 250], 1e-6 / 33);

  it('names another offset when the lower end of its |S| interval lies above the upper end of the centre’s', () => {
    const decision = decideAlignment(scanWith({ 0: 0.02, [-3]: 2.71 }));
    expect(decision.shifted).toBe(true);
    expect(decision.best).toEqual({ offset: -3, chshValue: 2.71, deviation: t, lower: 2.71 - t, upper: 2.71 + t });
    expect(decision.atCentre).toEqual({ offset: 0, chshValue: 0.02, deviation: t, lower: 0, upper: 0.02 + t });
    expect(decision.series).toHaveLength(2 * OFFSET_REACH + 1);
  });

  it('names none when the intervals overlap, however much larger the other S looks', () => {
    // 2t = 1.518: an S of 1.5 above the centre's is not enough, 1.53 is.
    expect(decideAlignment(scanWith({ 0: 0.1, 5: 1.6 })).shifted).toBe(false);
    expect(decideAlignment(scanWith({ 0: 0.1, 5: 1.63 })).shifted).toBe(true);
  });

  it('compares sizes: S of the other sign fits as well, and an aligned record is never called shifted', () => {
    expect(decideAlignment(scanWith({ 0: 0.0, 4: -2.7 })).best.offset).toBe(4);
    expect(decideAlignment(scanWith({ 0: 0.0, 4: -2.7 })).shifted).toBe(true);
    expect(decideAlignment(scanWith({ 0: 2.74, 6: 0.3 })).shifted).toBe(false);
  });

  it('never names an offset against a centre without rounds (its |S| may be anything up to 4)', () => {
    const decision = decideAlignment(scanWith({ 0: null, 2: 2.8 }));
    expect(decision.atCentre).toMatchObject({ chshValue: null, lower: 0, upper: 4 });
    expect(decision.shifted).toBe(false);
  });

  it('compares with the stated offset when the scan is centred on one', () => {
    const decision = decideAlignment(scanWith({ 10: 0.05, 13: 2.7 }, 10));
    expect(decision.atCentre.offset).toBe(10);
    expect(decision.best.offset).toBe(13);
    expect(decision.shifted).toBe(true);
  });

  it('takes more evidence at a smaller α', () => {
    const scan = scanWith({ 0: 0.1, 5: 1.63 });
    expect(decideAlignment(scan, 1e-12).shifted).toBe(false);
    expect(() => decideAlignment(scan, 0)).toThrow('the significance of the alignment rule must lie between 0 and 1, not 0');
  });
});
