import { stationCsvBytes } from '@fixtures/stations/station-csv';
import { KESTREL_FEN_TIMING, STATION_PAIR_SEED, StationPairOptions, stationRecord } from '@fixtures/stations/station-pair';
import { SCENARIO_SHIFTS, SLIP_PROBABILITY, stationPairScenarios } from '@fixtures/stations/station-scenarios';
import { LogSource } from '../../node/log-source';
import { decideAlignment } from '../alignment-decision';
import { alignmentSentence } from '../alignment-words';
import { JoinedRound } from '../joined-round';
import { scanOffsets } from '../offset-scan';
import { Station } from '../station-columns';
import { StationJoin } from '../station-join';
import { TimingCheck } from '../timing-check';
import { asyncSlices } from '../testing/async-slices';
import { readStationLog } from './station-log-file';

// The two-station analysis on pairs from the committed generator (fixtures/stations/): every
// scenario's two logs are written in memory, then read, joined, scanned and timed as files would be.

const ROUNDS = 10_000;

/** A log held in memory, handed out in 64 KiB pieces like a file read. */
function memorySource(bytes: Uint8Array): LogSource {
  return { open: () => asyncSlices(bytes, 65_536), bytes: bytes.length };
}

/** The two logs of a pair. */
function pairLogs(options: StationPairOptions, seed: string, gzip: Record<Station, boolean> = { A: false, B: false }): Record<Station, LogSource> {
  const log = (station: Station) => memorySource(stationCsvBytes(station, stationRecord(station, options, seed), { gzip: gzip[station] }));
  return { A: log('A'), B: log('B') };
}

/** Joins the pair (timing each round) and scans its offsets, each a pass of its own over both logs. */
async function analysePair(logs: Record<Station, LogSource>) {
  const a = readStationLog(logs.A, 'A');
  const b = readStationLog(logs.B, 'B');
  const join = new StationJoin(a.rows, b.rows);
  const timing = new TimingCheck(KESTREL_FEN_TIMING.geometry);
  const joined: JoinedRound[] = [];
  for await (const batch of join.rounds()) {
    timing.add(batch);
    joined.push(...batch.rounds());
  }
  const decision = decideAlignment(await scanOffsets(readStationLog(logs.A, 'A').rows, readStationLog(logs.B, 'B').rows));
  expect(a.summary().problems.concat(b.summary().problems)).toEqual([]);
  return { joined, join: join.summary(), timing: timing.summary(), decision, compression: { A: a.compression(), B: b.compression() } };
}

/** The seed of run `n` of a check over several seeds: the pair seed with n in its last byte. */
const seedOf = (n: number) => STATION_PAIR_SEED.slice(0, 62) + n.toString(16).padStart(2, '0');

describe('two station logs from the generator', () => {
  it.each(SCENARIO_SHIFTS.map((shift) => [shift] as const))("catches B's record shifted by %i rounds, with that offset and sign", async (shift) => {
    const { decision } = await analysePair(pairLogs({ rounds: ROUNDS, shiftB: shift }, STATION_PAIR_SEED));
    expect(decision.shifted).toBe(true);
    expect(decision.best.offset).toBe(shift);
    // The device's S is 2√2 · 0.97 = 2.744; at zero the rounds are strangers: S near 0.
    expect(decision.best.chshValue).toBeCloseTo(2.744, 0);
    expect(Math.abs(decision.atCentre.chshValue ?? NaN)).toBeLessThan(0.3);
    const rounds = Math.abs(shift);
    expect(alignmentSentence(decision)).toMatch(
      new RegExp(`^Station B's record runs ${rounds} rounds? ${shift > 0 ? 'ahead of' : 'behind'} station A's: at that offset S = 2\\.\\d\\d, at zero −?0\\.\\d\\d\\.$`),
    );
  });

  it('joins a shifted pair as told once the caller states the offset, and then finds it aligned', async () => {
    const logs = pairLogs({ rounds: ROUNDS, shiftB: -4 }, STATION_PAIR_SEED);
    const statedOffset = { rounds: -4, reason: "the alignment check found B's record 4 rounds behind" };
    const join = new StationJoin(readStationLog(logs.A, 'A').rows, readStationLog(logs.B, 'B').rows, { statedOffset });
    const timing = new TimingCheck(KESTREL_FEN_TIMING.geometry);
    for await (const batch of join.rounds()) timing.add(batch);
    // B's record begins at trigger 4: A's first four rounds are the only ones B lacks.
    expect(join.summary()).toMatchObject({ joinedRounds: ROUNDS - 4, statedOffset, stationB: { lacking: 4, firstLacking: [0, 1, 2, 3] }, stationA: { lacking: 0 } });
    expect(timing.summary().notSpaceLike).toBe(0);
    const decision = decideAlignment(await scanOffsets(readStationLog(logs.A, 'A').rows, readStationLog(logs.B, 'B').rows, { centre: -4 }));
    expect(decision.shifted).toBe(false);
    expect(alignmentSentence(decision)).toMatch(/^No offset from −20 to \+12 fits clearly better than the stated offset \(−4\): S = 2\.7\d at the stated offset \(−4\)/);
  });

  it.each([1, 2, 3, 4, 5, 6].map((n) => [n] as const))('finds no shift in an aligned pair, nor in one without correlations (seed %i)', async (n) => {
    const aligned = await analysePair(pairLogs({ rounds: ROUNDS }, seedOf(n)));
    expect(aligned.decision.shifted).toBe(false);
    expect(aligned.decision.atCentre.chshValue).toBeCloseTo(2.744, 0);
    // Visibility 0: S is 0 at every offset, so any S found is noise, which the rule must not take for a shift.
    const uncorrelated = await analysePair(pairLogs({ rounds: ROUNDS, model: { visibility: () => 0 } }, seedOf(n)));
    expect(uncorrelated.decision.shifted).toBe(false);
    expect(Math.max(...uncorrelated.decision.series.map((entry) => Math.abs(entry.chshValue ?? NaN)))).toBeLessThan(0.5);
  });

  it('times an honest pair: every round space-like, the smallest margin within the jitter of the design', async () => {
    const { timing, join } = await analysePair(pairLogs({ rounds: ROUNDS }, STATION_PAIR_SEED));
    expect(join).toMatchObject({ joinedRounds: ROUNDS, missing: 0, span: { firstRound: 0, lastRound: ROUNDS - 1 } });
    // By hand: at B, A's setting (trigger + 50 ns + j₁) + d/c (4 336 333 ps) − B's outcome (trigger + 50 ns + j₂ + 1 600 ns + j₃)
    // − 1 500 ps = 2 734 833 + j₁ − j₂ − j₃ ps, the jitters 0 … 999 ps: 2 732 835 … 2 735 832 ps (A's margin alike).
    expect(timing).toMatchObject({ timedRounds: ROUNDS, notSpaceLike: 0, notSpaceLikeShare: 0 });
    expect(timing.smallestMargin?.picoseconds).toBeGreaterThanOrEqual(2_732_835);
    expect(timing.smallestMargin?.picoseconds).toBeLessThanOrEqual(2_735_832);
    expect(timing.histogram.filter((bin) => bin.rounds > 0)).toEqual([{ above: 0.6, upTo: 0.7, rounds: ROUNDS }]);
  });

  it("reports about 1 % of rounds without space-like separation when B's clock slips in 1 % of them: exactly those rounds", async () => {
    const scenario = stationPairScenarios(ROUNDS).find((s) => s.name === 'b-clock-slips')!;
    const { timing, decision } = await analysePair(pairLogs(scenario.options, STATION_PAIR_SEED));
    const slipped = [...stationRecord('B', scenario.options, STATION_PAIR_SEED)].filter((r) => r.clockSlipped).map((r) => r.round);
    expect(timing.notSpaceLike).toBe(slipped.length);
    expect(timing.firstNotSpaceLike).toEqual(slipped.slice(0, 10));
    // 1 % of 10 000: 100, binomial spread ±10 (3σ ±30).
    expect(timing.notSpaceLikeShare).toBeGreaterThan(SLIP_PROBABILITY - 0.003);
    expect(timing.notSpaceLikeShare).toBeLessThan(SLIP_PROBABILITY + 0.003);
    // A slipped round's B outcome comes 5 µs late: 2 734 833 − 5 000 000 = −2 265 167 ps, give or take the jitter.
    expect(timing.smallestMargin).toMatchObject({ station: 'B' });
    expect(timing.smallestMargin?.picoseconds).toBeGreaterThanOrEqual(-2_267_165);
    expect(decision.shifted).toBe(false);
  });

  it.each(['b-missing-burst', 'a-missing-burst'])('counts the burst of %s on its side only', async (name) => {
    const scenario = stationPairScenarios(ROUNDS).find((s) => s.name === name)!;
    const burst = scenario.options.burst!;
    const { join, decision } = await analysePair(pairLogs(scenario.options, STATION_PAIR_SEED));
    const lacking = {
      lacking: burst.rounds,
      firstLacking: Array.from({ length: 10 }, (_, i) => burst.firstTrigger + i),
      longestGap: { firstRound: burst.firstTrigger, rounds: burst.rounds },
    };
    const complete = { lacking: 0, firstLacking: [], longestGap: null };
    expect(join.stationA).toEqual(burst.station === 'A' ? lacking : complete);
    expect(join.stationB).toEqual(burst.station === 'B' ? lacking : complete);
    expect(join).toMatchObject({ joinedRounds: ROUNDS - burst.rounds, missing: burst.rounds, missingFromBoth: 0 });
    expect(decision.shifted).toBe(false);
  });

  it("reads B's record gzip and A's plain into the same join as two plain logs", async () => {
    const scenario = stationPairScenarios(ROUNDS).find((s) => s.name === 'b-gzip')!;
    const mixed = await analysePair(pairLogs(scenario.options, STATION_PAIR_SEED, scenario.gzip));
    const plain = await analysePair(pairLogs(scenario.options, STATION_PAIR_SEED));
    expect(mixed.compression).toEqual({ A: 'none', B: 'gzip' });
    expect(mixed.joined).toEqual(plain.joined);
    expect(mixed.join).toEqual(plain.join);
    expect(mixed.decision).toEqual(plain.decision);
  });

  it('fails the timing check of a shifted pair too: its times pair different triggers', async () => {
    const { timing } = await analysePair(pairLogs({ rounds: 2_000, shiftB: 2 }, STATION_PAIR_SEED));
    expect(timing.notSpaceLikeShare).toBe(1);
  });
});
