import fc from 'fast-check';
import { STATION_PAIR_SEED, stationRecord, type GeneratedStationRow } from '@fixtures/stations/station-pair';
import { analyseLog } from '../../node/analyse-log';
import type { AnalysisResult } from '../../result';
import { joinedLog, pairSources } from './testing/pair-sources';
import { analyseStationPair } from './analyse-station-pair';

// The pair's analysis is the engine's analysis of the joined log: on generated pairs whose records
// lose rounds (both sides, and bursts on one side only) and are cut short at their ends (both alike),
// analyseStationPair gives exactly what analyseLog gives on the log of the rounds both records hold,
// joined here by round index on its own, apart from the sections that describe the input.
// (A record that runs past the other's end has no such joined log: the span-ends specs cover it.)

const scenario = fc.record({
  rounds: fc.integer({ min: 2_000, max: 12_000 }),
  lossProbability: fc.constantFrom(0, 0.002),
  /** Rounds both records lack at the start and at the end. */
  head: fc.integer({ min: 0, max: 30 }),
  tail: fc.integer({ min: 0, max: 30 }),
  /** Bursts one record lacks, placed by a fraction of the rounds between the ends. */
  bursts: fc.array(fc.record({ station: fc.constantFrom('A' as const, 'B' as const), at: fc.double({ min: 0, max: 1, noNaN: true }), rounds: fc.integer({ min: 1, max: 40 }) }), {
    maxLength: 3,
  }),
  selection: fc.constantFrom({ mode: 'fixed-fraction', fraction: 0.5 }, { mode: 'bernoulli', probability: 0.3 }),
  seed: fc.stringMatching(/^[0-9a-f]{64}$/),
});

type Scenario = typeof scenario extends fc.Arbitrary<infer T> ? T : never;

/** Each station's record: the generated one, without the ends both lack and the bursts of its own. */
function records(s: Scenario): { A: GeneratedStationRow[]; B: GeneratedStationRow[] } {
  const full = { A: [...stationRecord('A', { rounds: s.rounds, model: { lossProbability: s.lossProbability } }, STATION_PAIR_SEED)], B: [] as GeneratedStationRow[] };
  full.B = [...stationRecord('B', { rounds: s.rounds, model: { lossProbability: s.lossProbability } }, STATION_PAIR_SEED)];
  const inner = full.A.length - s.head - s.tail;
  // A burst lies strictly inside the kept stretch, so that both records still begin and end alike.
  const lacks = (station: 'A' | 'B', position: number) =>
    position < s.head ||
    position >= full.A.length - s.tail ||
    s.bursts.some((burst) => {
      const first = s.head + 1 + Math.floor(burst.at * Math.max(inner - burst.rounds - 2, 0));
      return burst.station === station && position >= first && position < first + burst.rounds;
    });
  return { A: full.A.filter((_, i) => !lacks('A', i)), B: full.B.filter((_, i) => !lacks('B', i)) };
}

/** The result without what describes the input, and its fingerprint. */
function judged(result: AnalysisResult) {
  const { input: _input, stations: _stations, fingerprint: _fingerprint, ...rest } = result;
  return rest;
}

describe('analyseStationPair and the joined log', () => {
  it('gives the result analyseLog gives on the rounds both records hold', async () => {
    await fc.assert(
      fc.asyncProperty(scenario, async (s) => {
        const { A, B } = records(s);
        const byRound = new Map(B.map((row) => [row.round, row]));
        const joined = A.filter((row) => byRound.has(row.round)).map((row) => {
          const other = byRound.get(row.round)!;
          return { round: row.round, x: row.setting, y: other.setting, a: row.outcome, b: other.outcome };
        });
        const profile = { criterion: 'observed', minTestRounds: 100, missingRoundsTolerance: 0.02, driftBlocks: 4, testSelection: s.selection };
        const logs = pairSources({ A, B });
        const pair = await analyseStationPair(logs.A, logs.B, { profile, seed: s.seed });
        const single = await analyseLog(joinedLog(joined), { profile, seed: s.seed });
        expect(single.verdict).not.toBe('INVALID');
        expect(judged(pair)).toEqual(judged(single));
        expect(pair.stations?.join?.joinedRounds).toBe(joined.length);
      }),
      { numRuns: 12 },
    );
  });
});
