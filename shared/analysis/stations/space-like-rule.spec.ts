import { parseProfile } from '../profile';
import { joinedLogTimingRefusal, marginText, pairTimingRefusal, spaceLikeFinding } from './space-like-rule';
import { TimingSummary } from './timing-check';

const profileOf = (rule: 'reported' | 'required') => {
  const parsed = parseProfile({ spaceLikeSeparation: rule });
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.profile;
};
const REPORTED = profileOf('reported');
const REQUIRED = profileOf('required');

/** A timing summary of 10 000 timed rounds, the given ones not space-like, the smallest margin at B. */
const timing = (notSpaceLike: number, smallestPs: number): TimingSummary => ({
  lightTimePs: 4_336_333,
  clockOffsetPs: -123_456_789,
  clockUncertaintyPs: 1500,
  timedRounds: 10_000,
  untimedRounds: 0,
  notSpaceLike,
  notSpaceLikeShare: notSpaceLike / 10_000,
  firstNotSpaceLike: [],
  smallestMargin: { round: 1234, station: 'B', picoseconds: smallestPs },
  histogram: [],
});

describe('the space-like separation rule', () => {
  it('writes a margin in nanoseconds, exact to the picosecond, with its sign', () => {
    expect(marginText(-2_265_167)).toBe('−2\u2009265.167\u2009ns');
    expect(marginText(4_336_333)).toBe('4\u2009336.333\u2009ns');
    expect(marginText(7)).toBe('0.007\u2009ns');
    expect(marginText(0)).toBe('0.000\u2009ns');
  });

  it('names exactly what a pair lacks for its timing, and only when the profile requires it', () => {
    expect(pairTimingRefusal(REQUIRED, { geometry: false, untimedStations: [] })).toBe(
      "The profile requires space-like separation, but the timing of these station logs cannot be checked: no distance between the stations with station B's clock offset and its uncertainty was given.",
    );
    expect(pairTimingRefusal(REQUIRED, { geometry: true, untimedStations: ['B'] })).toBe(
      "The profile requires space-like separation, but the timing of these station logs cannot be checked: station B's log has no time columns (t_setting, t_outcome).",
    );
    expect(pairTimingRefusal(REQUIRED, { geometry: false, untimedStations: ['A', 'B'] })).toMatch(
      /was given, and neither station's log has the time columns \(t_setting, t_outcome\)\.$/,
    );
    expect(pairTimingRefusal(REQUIRED, { geometry: true, untimedStations: [] })).toBeNull();
    expect(pairTimingRefusal(REPORTED, { geometry: false, untimedStations: ['A', 'B'] })).toBeNull();
    expect(joinedLogTimingRefusal(REPORTED)).toBeNull();
    expect(joinedLogTimingRefusal(REQUIRED)).toMatch(/^The profile requires space-like separation, which only two station logs with their time columns/);
  });

  it('fails a run with rounds lacking separation under required, naming the count, the share and the smallest margin', () => {
    const finding = spaceLikeFinding(timing(100, -2_265_167), REQUIRED);
    expect(finding).toMatchObject({ id: 'space-like-separation', family: null, holds: false, alwaysBlocks: true, observed: 100, threshold: 0 });
    expect(finding.message).toBe(
      "100 of the 10\u2009000 timed rounds (1.0\u2009%) lack space-like separation: a station recorded its outcome before light from the other station's setting choice could have reached it. " +
        "The smallest margin is −2\u2009265.167\u2009ns (round 1\u2009234, at station B's outcome; light takes 4\u2009336.333\u2009ns between the stations).",
    );
  });

  it('only warns of the same rounds under reported, saying the profile does not judge them', () => {
    const finding = spaceLikeFinding(timing(100, -2_265_167), REPORTED);
    expect(finding).toMatchObject({ holds: false, alwaysBlocks: false });
    expect(finding.message).toMatch(/^100 of the 10\u2009000 timed rounds .* The profile reports the timing without judging it\.$/);
  });

  it('holds when every timed round is separated, and not when no round was timed', () => {
    const honest = spaceLikeFinding(timing(0, 2_732_835), REQUIRED);
    expect(honest.holds).toBe(true);
    expect(honest.message).toBe(
      "All 10\u2009000 timed rounds are space-like separated: the smallest margin is 2\u2009732.835\u2009ns (round 1\u2009234, at station B's outcome; light takes 4\u2009336.333\u2009ns between the stations).",
    );
    const none = spaceLikeFinding({ ...timing(0, 0), timedRounds: 0, notSpaceLikeShare: null, smallestMargin: null }, REQUIRED);
    expect(none.holds).toBe(false);
    expect(none.message).toBe("No joined round has both stations' times, so no round shows space-like separation.");
  });
});
