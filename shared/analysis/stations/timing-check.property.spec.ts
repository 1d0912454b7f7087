import fc from 'fast-check';
import { JoinedBatch, JoinedRound } from './joined-round';
import { MARGIN_BIN_COUNT, marginBin, marginBinOfSafe } from './margin-histogram';
import { LATEST_PICOSECOND_TIME } from './picosecond-time';
import { timingFrame } from './station-geometry';
import { LISTED_NOT_SPACE_LIKE, TimingCheck } from './timing-check';
import { roundMargins } from './timing-margins';

// The timing check reads most margins in doubles (a time's two exact parts, `picosecond-parts`) and
// falls back to bigints when the clocks are far apart. Whatever the times, its summary must be what
// the bigint arithmetic of `roundMargins` and `marginBin` gives, round by round.

const time = (near: bigint) => fc.bigInt({ min: near > 10n ** 13n ? near - 10n ** 13n : 0n, max: near + 10n ** 13n });
/** Times near one instant (the fast path), or anywhere up to 2^63 − 1 (the fallback), mixed. */
const instant = fc.oneof(fc.bigInt({ min: 0n, max: 10n ** 16n }), fc.bigInt({ min: 0n, max: LATEST_PICOSECOND_TIME - 10n ** 13n }));
const roundTimes = instant.chain((near) =>
  fc.record({ aSetting: time(near), aOutcome: time(near), bSetting: time(near), bOutcome: fc.oneof(time(near), fc.bigInt({ min: 0n, max: LATEST_PICOSECOND_TIME })) }),
);
const geometry = fc.record({
  stationDistanceM: fc.double({ min: 1e-3, max: 1e9, noNaN: true }),
  clockOffsetNs: fc.double({ min: -1e12, max: 1e12, noNaN: true }),
  clockUncertaintyNs: fc.double({ min: 0, max: 1e12, noNaN: true }),
});

describe('TimingCheck in doubles and in bigints', () => {
  it('gives the summary the exact margins give, round by round', () => {
    fc.assert(
      fc.property(geometry, fc.array(roundTimes, { minLength: 1, maxLength: 40 }), (where, times) => {
        const frame = timingFrame(where);
        fc.pre(frame.lightTimePs > 0n);
        const rounds: JoinedRound[] = times.map((t, i) => ({ round: 3 * i, x: 0, y: 1, a: 1, b: 0, times: t }));
        const check = new TimingCheck(where);
        check.add(JoinedBatch.of(rounds));

        const counts = new Array<number>(MARGIN_BIN_COUNT).fill(0);
        const notSpaceLike: number[] = [];
        let smallest: { round: number; station: string; margin: bigint } | null = null;
        for (const round of rounds) {
          const { atA, atB } = roundMargins(round.times!, frame);
          const station = atA <= atB ? 'A' : 'B';
          const margin = station === 'A' ? atA : atB;
          counts[marginBin(margin, frame.lightTimePs)]++;
          if (margin <= 0n) notSpaceLike.push(round.round);
          if (smallest === null || margin < smallest.margin) smallest = { round: round.round, station, margin };
        }
        const summary = check.summary();
        expect(summary.histogram.map((bin) => bin.rounds)).toEqual(counts);
        expect(summary.notSpaceLike).toBe(notSpaceLike.length);
        expect(summary.firstNotSpaceLike).toEqual(notSpaceLike.slice(0, LISTED_NOT_SPACE_LIKE));
        expect(summary.smallestMargin).toEqual({ round: smallest!.round, station: smallest!.station, picoseconds: Number(smallest!.margin) });
      }),
    );
  });

  it('bins a safe margin in doubles as marginBin does in bigints, on and beside every bin edge', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 3_335_640_952_000 }), fc.integer({ min: -11, max: 11 }), fc.integer({ min: -3, max: 3 }), (light, tenths, nudge) => {
        // k·light/10 rounded, then nudged: the margins where a rounded quotient would go wrong.
        const margin = Math.round((tenths * light) / 10) + nudge;
        expect(marginBinOfSafe(margin, light)).toBe(marginBin(BigInt(margin), BigInt(light)));
      }),
    );
  });
});
