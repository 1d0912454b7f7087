import { marginBin, marginBins, MARGIN_BIN_COUNT } from './margin-histogram';
import { roundMargins } from './timing-margins';

describe('roundMargins', () => {
  // 1.3 km: light takes 4 336 333 ps (rounded down). B's clock reads 1 000 000 ps more than A's; compared to within 500 ps.
  const frame = { lightTimePs: 4_336_333n, clockOffsetPs: 1_000_000n, clockUncertaintyPs: 500n };

  it('measures each outcome against the other station’s setting choice, on one clock, the uncertainty against the lab', () => {
    // True times (A's clock): both settings at 0 ps; A's outcome at 1 600 000 ps, B's at 1 700 000 ps.
    // B writes its times 1 000 000 ps later: setting 1 000 000, outcome 2 700 000.
    const times = { aSetting: 0n, aOutcome: 1_600_000n, bSetting: 1_000_000n, bOutcome: 2_700_000n };
    // At A: B's setting on A's clock is 1 000 000 − 1 000 000 = 0; its light arrives at 4 336 333;
    //   margin = 4 336 333 − 1 600 000 − 500 = 2 735 833.
    // At B: A's setting on B's clock is 0 + 1 000 000; light at 5 336 333; margin = 5 336 333 − 2 700 000 − 500 = 2 635 833.
    expect(roundMargins(times, frame)).toEqual({ atA: 2_735_833n, atB: 2_635_833n });
  });

  it('gives 0 for an outcome recorded just as the light arrives (not space-like) and a negative margin after it', () => {
    const onTheCone = { aSetting: 0n, aOutcome: 4_335_833n, bSetting: 1_000_000n, bOutcome: 1_000_000n };
    expect(roundMargins(onTheCone, frame).atA).toBe(0n);
    expect(roundMargins({ ...onTheCone, aOutcome: 4_335_834n }, frame).atA).toBe(-1n);
  });

  it('stays exact for times far beyond 2^53 ps', () => {
    const base = 9_000_000_000_000_000_000n;
    const times = { aSetting: base + 3n, aOutcome: base + 1_600_001n, bSetting: base + 1_000_007n, bOutcome: base + 2_700_011n };
    expect(roundMargins(times, frame)).toEqual({ atA: 4_336_333n + 7n - 1_600_001n - 500n, atB: 3n + 1_000_000n + 4_336_333n - 2_700_011n - 500n });
  });
});

describe('the margin histogram', () => {
  const light = 1000n;

  it('puts a margin in its tenth of the light time, open below and closed above', () => {
    expect(marginBin(0n, light)).toBe(10); // (−0.1, 0]: not space-like
    expect(marginBin(1n, light)).toBe(11); // (0, 0.1]
    expect(marginBin(100n, light)).toBe(11);
    expect(marginBin(101n, light)).toBe(12);
    expect(marginBin(-100n, light)).toBe(9); // (−0.2, −0.1]
    expect(marginBin(-99n, light)).toBe(10);
    expect(marginBin(1000n, light)).toBe(20); // (0.9, 1]
    expect(marginBin(1001n, light)).toBe(21); // (1, ∞)
    expect(marginBin(-1000n, light)).toBe(0); // (−∞, −1]
    expect(marginBin(-999n, light)).toBe(1);
  });

  it('labels its 22 bins by their edges in light times', () => {
    const bins = marginBins(new Float64Array(MARGIN_BIN_COUNT));
    expect(bins).toHaveLength(22);
    expect(bins[0]).toEqual({ above: null, upTo: -1, rounds: 0 });
    expect(bins[10]).toEqual({ above: -0.1, upTo: 0, rounds: 0 });
    expect(bins[11]).toEqual({ above: 0, upTo: 0.1, rounds: 0 });
    expect(bins[21]).toEqual({ above: 1, upTo: null, rounds: 0 });
  });
});
