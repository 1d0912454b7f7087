import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { writeStationCsv } from '@fixtures/stations/station-csv';
import { KESTREL_FEN_TIMING, STATION_PAIR_SEED, type StationPairOptions, stationRecord } from '@fixtures/stations/station-pair';
import type { AnalysisResult } from '@shared/analysis/result';
import { fixture, runAnalyse, SEED } from './run-analyse';

// `analyse A.csv B.csv`: two station logs judged as a pair, with the single log's exit codes.

const printed = (stdout: string) => JSON.parse(stdout) as AnalysisResult;
const { stationDistanceM, clockOffsetNs, clockUncertaintyNs } = KESTREL_FEN_TIMING.geometry;
const GEOMETRY = ['--distance-m', String(stationDistanceM), '--clock-offset-ns', String(clockOffsetNs), '--clock-uncertainty-ns', String(clockUncertaintyNs)];

describe('analyse command on two station logs', () => {
  let scratch: string;
  /** Writes a generated pair of 24 000 rounds; returns station A's and B's paths. */
  const writePair = async (name: string, options: Omit<StationPairOptions, 'rounds'>): Promise<[string, string]> => {
    const paths: [string, string] = [path.join(scratch, `${name}-a.csv`), path.join(scratch, `${name}-b.csv.gz`)];
    await writeStationCsv(paths[0], 'A', stationRecord('A', { rounds: 24_000, ...options }, STATION_PAIR_SEED));
    await writeStationCsv(paths[1], 'B', stationRecord('B', { rounds: 24_000, ...options }, STATION_PAIR_SEED), { gzip: true });
    return paths;
  };
  beforeAll(() => {
    scratch = mkdtempSync(path.join(tmpdir(), 'bellkeep-cli-pair-'));
  });
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  it('gives an aligned pair its verdict, exit 0, with both files, the alignment and the timing', async () => {
    const [a, b] = await writePair('aligned', {});
    const run = runAnalyse(a, b, '--seed', SEED, '--profile', fixture('observed-profile.json'), ...GEOMETRY);
    expect(run.stderr).toContain('verdict: ACCEPT');
    expect(run.status).toBe(0);
    const result = printed(run.stdout);
    expect(result.verdict).toBe('ACCEPT');
    expect(result.stations?.files.map((file) => [file.station, file.compression, file.rounds])).toEqual([
      ['A', 'none', 24_000],
      ['B', 'gzip', 24_000],
    ]);
    expect(result.stations?.alignment?.shifted).toBe(false);
    expect(result.stations?.timing).toMatchObject({ timedRounds: 24_000, notSpaceLike: 0 });
  });

  it('refuses a shifted pair, exit 3, naming the offset; stating that offset joins it as told', async () => {
    const [a, b] = await writePair('shifted', { shiftB: 2 });
    const refused = runAnalyse(a, b, '--seed', SEED, '--profile', fixture('observed-profile.json'));
    expect(refused.status).toBe(3);
    expect(printed(refused.stdout).reasons).toEqual([expect.stringMatching(/^Station B's record runs 2 rounds ahead of station A's: at that offset S = 2\.\d\d, at zero/)]);

    const reason = "B's counter counted two test triggers before the run";
    const stated = runAnalyse(a, b, '--seed', SEED, '--profile', fixture('observed-profile.json'), '--offset', '2', '--offset-reason', reason);
    expect(stated.status).toBe(0);
    expect(printed(stated.stdout).stations?.join?.statedOffset).toEqual({ rounds: 2, reason });
  });

  it('reads a pair written with ±1 outcomes under a mapping that says so, as the same pair written 0/1; a mapping of columns is refused', async () => {
    const write = async (name: string, outcomes: '0/1' | '±1') => {
      const paths = ['a', 'b'].map((station) => path.join(scratch, `${name}-${station}.csv`));
      for (const [i, station] of (['A', 'B'] as const).entries())
        await writeStationCsv(paths[i], station, stationRecord(station, { rounds: 6_000 }, STATION_PAIR_SEED), { outcomes });
      return paths;
    };
    const plusMinus = await write('plus-minus', '±1');
    const zeroOne = await write('zero-one', '0/1');
    const mappingFile = path.join(scratch, 'plus-minus.json');
    writeFileSync(mappingFile, JSON.stringify({ outcomes: '±1' }));
    const options = ['--seed', SEED, '--profile', fixture('observed-profile.json')];
    const mapped = runAnalyse(...plusMinus, ...options, '--mapping', mappingFile);
    const unmapped = runAnalyse(...zeroOne, ...options);
    expect(mapped.status).toBe(unmapped.status);
    const [asPlusMinus, asZeroOne] = [printed(mapped.stdout), printed(unmapped.stdout)];
    expect(asPlusMinus.verdict).not.toBe('INVALID');
    expect(asPlusMinus.reasons).toEqual(asZeroOne.reasons);
    expect(asPlusMinus.chsh).toEqual(asZeroOne.chsh);
    expect(asPlusMinus.qber).toEqual(asZeroOne.qber);
    expect(asPlusMinus.input.mapping).toEqual({ columns: {}, outcomes: '±1' });
    // Without the mapping the ±1 logs are refused row by row, naming the outcome column.
    expect(printed(runAnalyse(...plusMinus, ...options).stdout).errors[0]).toMatchObject({ column: 'a', value: '-1' });

    const columnsFile = path.join(scratch, 'columns.json');
    writeFileSync(columnsFile, JSON.stringify({ columns: { round: 'trigger' } }));
    const refused = runAnalyse(...plusMinus, ...options, '--mapping', columnsFile);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toContain('analyse: mapping: a station log is read by its own column names');
  });

  it.each([
    [['--offset', '2'], '--offset and --offset-reason go together'],
    [['--offset', 'two', '--offset-reason', 'why'], '--offset must be a whole number'],
    [['--distance-m', '1300'], 'the timing check needs --distance-m, --clock-offset-ns, --clock-uncertainty-ns together'],
    [['--threads', '2'], '--threads applies to a single round log'],
    [['--distance-m', '-5', '--clock-offset-ns', '0', '--clock-uncertainty-ns', '1'], 'stationDistanceM must be above 0'],
  ])('exits 2 on a usage error of a pair: %j', (options, words) => {
    const run = runAnalyse(fixture('accepted-run.csv'), fixture('accepted-run.csv'), ...options);
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain(words);
  });

  it('exits 2 when a pair option comes with one log, or three logs are given', () => {
    expect(runAnalyse(fixture('accepted-run.csv'), '--offset', '1', '--offset-reason', 'why').stderr).toContain('--offset needs two station logs');
    const three = runAnalyse('a.csv', 'b.csv', 'c.csv');
    expect(three.status).toBe(2);
    expect(three.stderr).toContain('one round log or two station logs expected, got 3');
  });
});
