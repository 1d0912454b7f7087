import { createReadStream, createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { join } from 'node:path';
import { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGzip } from 'node:zlib';
import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';
import { writeStationCsv } from '@fixtures/stations/station-csv';
import { stationRecord } from '@fixtures/stations/station-pair';
import type { StoredCensus } from '@shared/analysis/node';
import { CensusTap } from '@server/runs/census-tap';
import { DigestStream } from '@server/storage/digest-stream';
import { modelLogChunks } from './pipeline/model-log-chunks';

/** Writes a plain log of `rounds` rounds of the Kestrel Fen model to `path`. */
export async function writeBenchLog(path: string, rounds: number): Promise<void> {
  const file = createWriteStream(path);
  for (const chunk of modelLogChunks({ ...steadyPair, rounds }, FIXTURE_SEED)) {
    if (!file.write(chunk)) {
      await once(file, 'drain');
    }
  }
  file.end();
  await once(file, 'finish');
}

/**
 * Writes the two station logs of the same run as `writeBenchLog` (the same model, seed and rounds,
 * each station its half: A `round,x,a`, B `round,y,b`), with the fixtures' Kestrel Fen times or
 * without; returns station A's and B's paths.
 */
export async function writeBenchStationPair(folder: string, rounds: number, times: boolean): Promise<[string, string]> {
  const name = (station: string) => join(folder, `pair-${rounds}${times ? '-timed' : ''}.station-${station}.csv`);
  const paths: [string, string] = [name('a'), name('b')];
  await writeStationCsv(paths[0], 'A', stationRecord('A', { rounds }, FIXTURE_SEED), { times });
  await writeStationCsv(paths[1], 'B', stationRecord('B', { rounds }, FIXTURE_SEED), { times });
  return paths;
}

/** The census an upload of this log (plain or gzip) would store, taken the same way, with its SHA-256. */
export async function censusOfBenchLog(path: string): Promise<StoredCensus> {
  const tap = new CensusTap();
  const digest = new DigestStream();
  await pipeline(createReadStream(path, { highWaterMark: 1 << 20 }), tap, digest, new Writable({ write: (_chunk, _encoding, done) => done() }));
  return { sha256: digest.sha256, census: tap.census! };
}

/** Writes the gzip (default level, as `gzip` does) of the file at `plain` to `path`. */
export async function gzipBenchLog(plain: string, path: string): Promise<void> {
  await pipeline(createReadStream(plain, { highWaterMark: 1 << 20 }), createGzip(), createWriteStream(path));
}
