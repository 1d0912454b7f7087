import { JoinedBatch, JoinedRound } from './joined-round';
import { TimingCheck } from './timing-check';

/** A round whose outcomes are recorded `aLate` and `bLate` ps after both settings (true times; B's clock reads 1 000 000 ps more). */
function round(index: number, aLate: bigint, bLate: bigint): JoinedRound {
  const start = BigInt(index) * 10_000_000n;
  return { round: index, x: 0, y: 0, a: 0, b: 0, times: { aSetting: start, aOutcome: start + aLate, bSetting: start + 1_000_000n, bOutcome: start + 1_000_000n + bLate } };
}

describe('TimingCheck', () => {
  // 1.3 km (4 336 333 ps), B's clock 1 000 ns ahead of A's, compared to within 0.5 ns.
  const geometry = { stationDistanceM: 1300, clockOffsetNs: 1000, clockUncertaintyNs: 0.5 };

  it('counts the rounds without space-like separation, finds the smallest margin and bins every round', () => {
    const check = new TimingCheck(geometry);
    check.add(JoinedBatch.of([round(0, 1_600_000n, 1_700_000n), round(1, 4_335_833n, 1_000n)]));
    check.add(JoinedBatch.of([{ ...round(2, 0n, 0n), times: null }]));
    check.add(JoinedBatch.of([round(3, 1_000n, 9_000_000n)]));
    const summary = check.summary();
    // Round 1: A's margin 4 336 333 − 4 335 833 − 500 = 0 (not space-like). Round 3: B's 4 336 333 − 9 000 000 − 500 = −4 664 167.
    expect(summary).toMatchObject({
      lightTimePs: 4_336_333,
      clockOffsetPs: 1_000_000,
      clockUncertaintyPs: 500,
      timedRounds: 3,
      untimedRounds: 1,
      notSpaceLike: 2,
      notSpaceLikeShare: 2 / 3,
      firstNotSpaceLike: [1, 3],
      smallestMargin: { round: 3, station: 'B', picoseconds: -4_664_167 },
    });
    // Round 0's smaller margin is B's, 2 635 833 = 0.608 light times: bin (0.6, 0.7]; round 1 in (−0.1, 0]; round 3 (−1.08) in (−∞, −1].
    expect(summary.histogram.filter((bin) => bin.rounds > 0)).toEqual([
      { above: null, upTo: -1, rounds: 1 },
      { above: -0.1, upTo: 0, rounds: 1 },
      { above: 0.6, upTo: 0.7, rounds: 1 },
    ]);
  });

  it('has no share and no smallest margin without timed rounds', () => {
    const check = new TimingCheck(geometry);
    check.add(JoinedBatch.of([{ ...round(0, 0n, 0n), times: null }]));
    expect(check.summary()).toMatchObject({ timedRounds: 0, untimedRounds: 1, notSpaceLikeShare: null, smallestMargin: null });
  });
});
