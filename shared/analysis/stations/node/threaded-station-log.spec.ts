import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { stationCsvBytes } from '@fixtures/stations/station-csv';
import { KESTREL_FEN_TIMING, STATION_PAIR_SEED, StationPairOptions, stationRecord } from '@fixtures/stations/station-pair';
import { AnalysisRequestError } from '../../node/analysis-errors';
import { Station } from '../station-columns';
import { STATION_BATCH_ROWS } from '../station-log-reader';
import { analyseStationPair } from './analyse-station-pair';
import { memorySource } from './testing/pair-sources';

// Two station log files are read on two cores: station B's in a thread of its own, which sends its
// batches' columns over and gets them back to fill again. Whatever the logs hold, the result must
// be the one the same bytes give read in one thread (as streams).

const PROFILE = { criterion: 'observed', minTestRounds: 500 };
const SEED = '6d'.repeat(32);

describe('station B read in a thread of its own', () => {
  let folder: string;
  beforeAll(() => (folder = mkdtempSync(path.join(tmpdir(), 'bellkeep-threaded-'))));
  afterAll(() => rmSync(folder, { recursive: true, force: true }));

  /** The pair as files and as streams, analysed both ways. */
  async function bothWays(name: string, bytes: Record<Station, Uint8Array>) {
    const files = (['A', 'B'] as const).map((station) => {
      const file = path.join(folder, `${name}-${station}.csv`);
      writeFileSync(file, bytes[station]);
      return { path: file };
    });
    const options = { profile: PROFILE, seed: SEED, geometry: KESTREL_FEN_TIMING.geometry };
    const threaded = await analyseStationPair(files[0], files[1], options);
    const oneThread = await analyseStationPair(memorySource(bytes.A), memorySource(bytes.B), options);
    return { threaded, oneThread };
  }

  const pairBytes = (options: StationPairOptions, gzipB = false) => ({
    A: stationCsvBytes('A', stationRecord('A', options, STATION_PAIR_SEED)),
    B: stationCsvBytes('B', stationRecord('B', options, STATION_PAIR_SEED), { gzip: gzipB }),
  });

  it.each([
    ['an aligned timed pair over many batches', pairBytes({ rounds: 5 * STATION_BATCH_ROWS + 17 })],
    ['a gzip B with a burst missing', pairBytes({ rounds: 3 * STATION_BATCH_ROWS, burst: { station: 'B', firstTrigger: 9_000, rounds: 40 } }, true)],
    ['a B shifted by three rounds', pairBytes({ rounds: 2 * STATION_BATCH_ROWS, shiftB: 3 })],
  ])('%s: the same result as read in one thread', async (name, bytes) => {
    const { threaded, oneThread } = await bothWays(name.replace(/\W+/g, '-'), bytes);
    expect(threaded).toEqual(oneThread);
  });

  it('names a bad row of B as read in one thread', async () => {
    const bytes = pairBytes({ rounds: 2 * STATION_BATCH_ROWS });
    const text = new TextDecoder().decode(bytes.B).replace('\n10000,', '\n10000.5,');
    const { threaded, oneThread } = await bothWays('bad-row', { A: bytes.A, B: new TextEncoder().encode(text) });
    expect(threaded.verdict).toBe('INVALID');
    expect(threaded.errors[0]).toMatchObject({ column: 'round', value: '10000.5' });
    expect(threaded).toEqual(oneThread);
  });

  it('refuses a B file that is not there, naming it, before any thread starts', async () => {
    const a = path.join(folder, 'lonely-A.csv');
    writeFileSync(a, pairBytes({ rounds: 100 }).A);
    const missing = path.join(folder, 'not-there.csv');
    await expect(analyseStationPair({ path: a }, { path: missing }, { profile: PROFILE, seed: SEED })).rejects.toThrow(
      new AnalysisRequestError(`cannot read ${missing}: ENOENT: no such file or directory, stat '${missing}'`, 'io'),
    );
  });
});
