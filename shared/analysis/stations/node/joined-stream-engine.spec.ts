import { Readable } from 'node:stream';
import { analyseRounds } from '@fixtures/adversaries/analyse-rounds';
import { acquireRun, ModelRound } from '@fixtures/device-model';
import { steadyPair } from '@fixtures/fixture-set';
import { stationCsvBytes } from '@fixtures/stations/station-csv';
import { STATION_PAIR_SEED, StationPairOptions, stationRecord } from '@fixtures/stations/station-pair';
import { analyseLog } from '../../node/analyse-log';
import { LogSource } from '../../node/log-source';
import { StationJoin } from '../station-join';
import { readStationLog } from './station-log-file';

// What the engine needs from two station logs is the joined log it already reads: the rounds both
// stations recorded, in order, with the round index as the trigger count. Fed to the engine's own
// record path (`RangeAnalysis`, through analyseRounds), the joined rounds must give the very result
// the engine gives on the pre-joined log written from the same run.

const memorySource = (bytes: Uint8Array): LogSource => ({ open: () => Readable.from([bytes]) });

const PROFILE = { criterion: 'observed', minTestRounds: 100, driftBlocks: 4 };
const SELECTION_SEED = '7e'.repeat(32);

describe('the joined stream and the engine', () => {
  it.each([
    ['an aligned pair', { rounds: 6_000 }],
    ['a pair with a burst missing from B', { rounds: 6_000, burst: { station: 'B' as const, firstTrigger: 2_500, rounds: 3 } }],
    ['a pair whose stations both lose rounds', { rounds: 6_000, model: { lossProbability: 0.0005 } }],
  ] as [string, StationPairOptions][])('%s: the same result as the pre-joined log', async (_, options) => {
    const log = (station: 'A' | 'B') => memorySource(stationCsvBytes(station, stationRecord(station, options, STATION_PAIR_SEED)));
    const join = new StationJoin(readStationLog(log('A'), 'A').rows, readStationLog(log('B'), 'B').rows);
    const joined: ModelRound[] = [];
    for await (const batch of join.rounds()) joined.push(...batch.rounds().map((r) => ({ round: r.round, x: r.x, y: r.y, a: r.a, b: r.b, test: 0 })));

    const burst = options.burst;
    const kept = [...acquireRun({ ...steadyPair, ...options.model, rounds: options.rounds }, STATION_PAIR_SEED)].filter(
      (r) => burst === undefined || r.round < burst.firstTrigger || r.round >= burst.firstTrigger + burst.rounds,
    );
    const preJoined = 'round,x,y,a,b\n' + kept.map((r) => `${r.round},${r.x},${r.y},${r.a},${r.b}\n`).join('');
    const { input: _fromFile, fingerprint: _sealed, ...fromFile } = await analyseLog(memorySource(new TextEncoder().encode(preJoined)), { profile: PROFILE, seed: SELECTION_SEED });
    const { input: _inMemory, ...fromJoin } = analyseRounds(joined, PROFILE, SELECTION_SEED);

    expect(fromJoin).toEqual(fromFile);
    expect(fromJoin.missingRounds?.missing).toBe(join.summary().missing);
    expect(fromFile.verdict).not.toBe('INVALID');
  });
});
