import { stationCsvBytes } from '@fixtures/stations/station-csv';
import { KESTREL_FEN_TIMING, STATION_PAIR_SEED, StationPairOptions, stationRecord } from '@fixtures/stations/station-pair';
import { SLIP_PS, stationPairScenarios } from '@fixtures/stations/station-scenarios';
import { formatCount } from '../../../format/numbers';
import { AnalysisResult } from '../../result';
import { marginText } from '../space-like-rule';
import { Station } from '../station-columns';
import { analyseStationPair, StationPairAnalysisOptions } from './analyse-station-pair';
import { memorySource, pairSources } from './testing/pair-sources';

// A profile's `spaceLikeSeparation` on generated station pairs (fixtures/stations/): reported, the
// timing is a check that warns; required, it blocks, and a pair whose timing cannot be checked is
// INVALID with what it lacks.

const ROUNDS = 12_000;
const SEED = '3c'.repeat(32);
const REPORTED = { criterion: 'observed', minTestRounds: 500 };
const REQUIRED = { ...REPORTED, spaceLikeSeparation: 'required' };
const GEOMETRY = KESTREL_FEN_TIMING.geometry;

const generated = (options: StationPairOptions) => ({ A: stationRecord('A', options, STATION_PAIR_SEED), B: stationRecord('B', options, STATION_PAIR_SEED) });
const slipping = stationPairScenarios(ROUNDS).find((scenario) => scenario.name === 'b-clock-slips')!.options;

async function analysed(options: StationPairOptions, settings: StationPairAnalysisOptions): Promise<AnalysisResult> {
  const logs = pairSources(generated(options));
  return analyseStationPair(logs.A, logs.B, { seed: SEED, ...settings });
}

const timingCheck = (result: AnalysisResult) => result.checks.find((check) => check.id === 'space-like-separation');

describe('space-like separation as a profile asks for it', () => {
  it('aborts a pair whose B clock slips in 1 % of the rounds when required, naming the count, the share and the smallest margin; reported, it is ACCEPT with a warning', async () => {
    const required = await analysed(slipping, { profile: REQUIRED, geometry: GEOMETRY });
    const reported = await analysed(slipping, { profile: REPORTED, geometry: GEOMETRY });
    const timing = required.stations!.timing!;
    const slipped = [...stationRecord('B', slipping, STATION_PAIR_SEED)].filter((row) => row.clockSlipped).length;
    expect(timing.notSpaceLike).toBe(slipped);

    expect(required.verdict).toBe('ABORT');
    // The slipped outcome comes 5 µs late: the margin 2 734 833 ps of an honest round less 5 000 000, within the jitter.
    const smallest = timing.smallestMargin!;
    expect(smallest.station).toBe('B');
    expect(smallest.picoseconds).toBeGreaterThanOrEqual(2_732_835 - Number(SLIP_PS));
    expect(smallest.picoseconds).toBeLessThanOrEqual(2_735_832 - Number(SLIP_PS));
    // About 1 % (binomial spread ±0.3 % at 3σ), written with two significant digits.
    expect(slipped / ROUNDS).toBeGreaterThan(0.007);
    expect(slipped / ROUNDS).toBeLessThan(0.013);
    const share = ((100 * slipped) / ROUNDS).toPrecision(2);
    expect(required.reasons).toEqual([
      `The test “Space-like separation” failed: ${slipped} of the 12\u2009000 timed rounds (${share}\u2009%) lack space-like separation: ` +
        `a station recorded its outcome before light from the other station's setting choice could have reached it. ` +
        `The smallest margin is ${marginText(smallest.picoseconds)} (round ${formatCount(smallest.round)}, at station B's outcome; light takes 4\u2009336.333\u2009ns between the stations).`,
    ]);
    expect(marginText(smallest.picoseconds)).toMatch(/^−2\u200926\d\.\d{3}\u2009ns$/);
    expect(timingCheck(required)).toMatchObject({ status: 'fail', observed: slipped, threshold: 0, log10PValue: null });

    expect(reported.verdict).toBe('ACCEPT');
    expect(reported.reasons).toEqual([]);
    expect(timingCheck(reported)).toMatchObject({ status: 'warn', observed: slipped });
    expect(timingCheck(reported)?.message).toMatch(/The profile reports the timing without judging it\.$/);
    // Only the rule differs: the same figures either way.
    expect(reported.chsh).toEqual(required.chsh);
    expect(reported.stations).toEqual(required.stations);
  });

  it('accepts an honest pair under required, its timing check passing', async () => {
    const result = await analysed({ rounds: ROUNDS }, { profile: REQUIRED, geometry: GEOMETRY });
    expect(result.verdict).toBe('ACCEPT');
    expect(timingCheck(result)).toMatchObject({ status: 'pass', observed: 0 });
    expect(timingCheck(result)?.message).toMatch(/^All 12\u2009000 timed rounds are space-like separated: the smallest margin is 2\u200973\d\.\d{3}\u2009ns/);
  });

  it('calls a pair INVALID under required when no geometry was given, saying so; reported, it is judged without a timing check', async () => {
    const required = await analysed({ rounds: ROUNDS }, { profile: REQUIRED });
    expect(required).toMatchObject({ verdict: 'INVALID', chsh: null, checks: [], errors: [], stations: { timing: null, alignment: { shifted: false } } });
    expect(required.reasons).toEqual([
      "The profile requires space-like separation, but the timing of these station logs cannot be checked: no distance between the stations with station B's clock offset and its uncertainty was given.",
    ]);
    const reported = await analysed({ rounds: ROUNDS }, { profile: REPORTED });
    expect(reported.verdict).toBe('ACCEPT');
    expect(timingCheck(reported)).toBeUndefined();
  });

  it('names the station whose log has no times, and both missing pieces together', async () => {
    const rows = generated({ rounds: 3000 });
    const untimedB: Record<Station, Uint8Array> = { A: stationCsvBytes('A', rows.A), B: stationCsvBytes('B', rows.B, { times: false }) };
    const withGeometry = await analyseStationPair(memorySource(untimedB.A), memorySource(untimedB.B), { profile: REQUIRED, seed: SEED, geometry: GEOMETRY });
    expect(withGeometry.verdict).toBe('INVALID');
    expect(withGeometry.reasons).toEqual([expect.stringMatching(/cannot be checked: station B's log has no time columns \(t_setting, t_outcome\)\.$/)]);
    const without = await analyseStationPair(memorySource(untimedB.A), memorySource(untimedB.B), { profile: REQUIRED, seed: SEED });
    expect(without.reasons).toEqual([expect.stringMatching(/uncertainty was given, and station B's log has no time columns \(t_setting, t_outcome\)\.$/)]);
  });

  it('gives a shifted pair whose timing cannot be checked both sentences', async () => {
    const result = await analysed({ rounds: ROUNDS, shiftB: 3 }, { profile: REQUIRED });
    expect(result.verdict).toBe('INVALID');
    expect(result.reasons).toEqual([expect.stringMatching(/^The profile requires space-like separation, but/), result.stations?.alignment?.sentence]);
    expect(result.reasons[1]).toMatch(/^Station B's record runs 3 rounds ahead of station A's/);
  });
});
