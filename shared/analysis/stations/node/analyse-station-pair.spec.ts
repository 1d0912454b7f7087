import { createHash } from 'node:crypto';
import { stationCsvBytes } from '@fixtures/stations/station-csv';
import { KESTREL_FEN_TIMING, STATION_PAIR_SEED, StationPairOptions, stationRecord } from '@fixtures/stations/station-pair';
import { AnalysisRequestError } from '../../node/analysis-errors';
import { LogSource } from '../../node/log-source';
import { Station } from '../station-columns';
import { memorySource, pairSources } from './testing/pair-sources';
import { analyseStationPair } from './analyse-station-pair';

// The engine's entry for two station logs: the verdict rules of a pair (a shift found is INVALID
// with its sentence, a stated offset is applied and shown, the timing is reported), and what the
// result says of each file.

const ROUNDS = 12_000;
const PROFILE = { criterion: 'observed', minTestRounds: 500 };
const SEED = '3c'.repeat(32);

const generated = (options: StationPairOptions) => ({ A: stationRecord('A', options, STATION_PAIR_SEED), B: stationRecord('B', options, STATION_PAIR_SEED) });
const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

describe('analyseStationPair', () => {
  it('judges an aligned pair and reports both files, the join, the alignment and the timing', async () => {
    const bytes = { A: stationCsvBytes('A', generated({ rounds: ROUNDS }).A), B: stationCsvBytes('B', generated({ rounds: ROUNDS }).B, { gzip: true }) };
    const result = await analyseStationPair(memorySource(bytes.A), memorySource(bytes.B), { profile: PROFILE, seed: SEED, geometry: KESTREL_FEN_TIMING.geometry });
    // The device's S is 2√2 · 0.97 = 2.744, a win fraction near 0.843, above 0.853553 − 0.03.
    expect(result.verdict).toBe('ACCEPT');
    expect(result.missingRounds).toMatchObject({ firstRound: 0, lastRound: ROUNDS - 1, missing: 0 });
    expect(result.stations?.files).toEqual([
      {
        station: 'A',
        sha256: sha256(bytes.A),
        bytes: bytes.A.length,
        compression: 'none',
        records: ROUNDS,
        rounds: ROUNDS,
        firstRound: 0,
        lastRound: ROUNDS - 1,
        hasTimes: true,
        problemCount: 0,
      },
      {
        station: 'B',
        sha256: sha256(bytes.B),
        bytes: bytes.B.length,
        compression: 'gzip',
        records: ROUNDS,
        rounds: ROUNDS,
        firstRound: 0,
        lastRound: ROUNDS - 1,
        hasTimes: true,
        problemCount: 0,
      },
    ]);
    expect(result.input).toMatchObject({
      sha256: sha256(Buffer.from(`${sha256(bytes.A)}\n${sha256(bytes.B)}\n`)),
      bytes: bytes.A.length + bytes.B.length,
      rounds: ROUNDS,
      compression: 'gzip',
    });
    expect(result.stations?.join).toMatchObject({ joinedRounds: ROUNDS, missing: 0, statedOffset: null });
    expect(result.stations?.alignment).toMatchObject({ centre: 0, shifted: false, roundsRead: ROUNDS });
    expect(result.stations?.alignment?.series).toHaveLength(33);
    expect(result.stations?.alignment?.sentence).toMatch(/^No offset from −16 to \+16 fits clearly better than zero: S = 2\.7\d at zero/);
    expect(result.stations?.timing).toMatchObject({ timedRounds: ROUNDS, notSpaceLike: 0 });
  });

  it.each([3, -5])('refuses a pair whose B record is shifted by %i rounds, naming the shift, never realigning it', async (shift) => {
    const logs = pairSources(generated({ rounds: ROUNDS, shiftB: shift }));
    const result = await analyseStationPair(logs.A, logs.B, { profile: PROFILE, seed: SEED });
    expect(result.verdict).toBe('INVALID');
    expect(result.reasons).toEqual([expect.stringMatching(new RegExp(`^Station B's record runs ${Math.abs(shift)} rounds ${shift > 0 ? 'ahead of' : 'behind'} station A's`))]);
    expect(result.reasons).toEqual([result.stations?.alignment?.sentence]);
    expect(result).toMatchObject({ chsh: null, counts: null, errors: [], errorCount: 0, stations: { alignment: { shifted: true, bestOffset: shift } } });
  });

  it('applies a stated offset as given, shows it with its reason, and judges the pair so joined', async () => {
    const logs = pairSources(generated({ rounds: ROUNDS, shiftB: -4 }));
    const statedOffset = { rounds: -4, reason: "station B's counter was started four triggers late" };
    const result = await analyseStationPair(logs.A, logs.B, { profile: PROFILE, seed: SEED, statedOffset });
    expect(result.verdict).toBe('ACCEPT');
    expect(result.stations?.join).toMatchObject({ statedOffset, joinedRounds: ROUNDS - 4, stationB: { lacking: 4, firstLacking: [0, 1, 2, 3] } });
    expect(result.stations?.alignment).toMatchObject({ centre: -4, shifted: false });
    // A's first four rounds have no B round: missing, the span still A's 0 … ROUNDS − 1.
    expect(result.missingRounds).toMatchObject({ firstRound: 0, lastRound: ROUNDS - 1, missing: 4 });
  });

  it('reports no timing without the geometry, nor when a log has no times', async () => {
    const untimed = { A: memorySource(stationCsvBytes('A', generated({ rounds: 3000 }).A, { times: false })), B: pairSources(generated({ rounds: 3000 })).B };
    const withoutTimes = await analyseStationPair(untimed.A, untimed.B, { profile: PROFILE, seed: SEED, geometry: KESTREL_FEN_TIMING.geometry });
    expect(withoutTimes.stations?.timing).toBeNull();
    expect(withoutTimes.stations?.files.map((file) => file.hasTimes)).toEqual([false, true]);
    const logs = pairSources(generated({ rounds: 3000 }));
    expect((await analyseStationPair(logs.A, logs.B, { profile: PROFILE, seed: SEED })).stations?.timing).toBeNull();
  });

  it('is INVALID when a station log has a bad row, naming the station', async () => {
    const good = stationCsvBytes('B', generated({ rounds: 3000 }).B);
    const bad = new TextEncoder().encode('round,x,a\n0,0,1\n1,7,0\n2,1,1\n');
    const result = await analyseStationPair(memorySource(bad), memorySource(good), { profile: PROFILE, seed: SEED });
    expect(result.verdict).toBe('INVALID');
    expect(result.errors.map(({ line, column, value }) => ({ line, column, value }))).toEqual([{ line: 3, column: 'x', value: '7' }]);
    expect(result.errors[0].message).toMatch(/^station A's log: /);
    expect(result.reasons[0]).toMatch(/^The log has a problem\. The first is on line 3: station A's log: /);
    expect(result.stations).toMatchObject({
      join: null,
      alignment: null,
      files: [
        { station: 'A', problemCount: 1 },
        { station: 'B', problemCount: 0 },
      ],
    });
  });

  it('refuses a profile that takes the test rounds from the log, a stated offset without a reason and a geometry out of range', async () => {
    const logs: Record<Station, LogSource> = pairSources(generated({ rounds: 100 }));
    await expect(analyseStationPair(logs.A, logs.B, { profile: { testSelection: { mode: 'from-log' } } })).rejects.toThrow(/station logs carry no test marks/);
    await expect(analyseStationPair(logs.A, logs.B, { statedOffset: { rounds: 2, reason: ' ' } })).rejects.toThrow(AnalysisRequestError);
    await expect(analyseStationPair(logs.A, logs.B, { geometry: { stationDistanceM: -1, clockOffsetNs: 0, clockUncertaintyNs: 0 } })).rejects.toThrow(/stationDistanceM/);
  });
});
