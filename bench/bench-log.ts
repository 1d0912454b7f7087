import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { pipeline } from 'node:stream/promises';
import { createGzip } from 'node:zlib';
import { FIXTURE_SEED, steadyPair } from '../fixtures/fixture-set';
import { LogCensusTaker } from '../shared/analysis/log/log-census';
import type { StoredCensus } from '../shared/analysis/node';
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

/** Writes the gzip (default level, as `gzip` does) of the file at `plain` to `path`. */
/** The census an upload of this plain log would store (see server/runs/census-tap.ts), with its SHA-256. */
export async function censusOfBenchLog(path: string): Promise<StoredCensus> {
  const taker = new LogCensusTaker();
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(path, { highWaterMark: 1 << 20 }) as AsyncIterable<Buffer>) {
    taker.push(chunk);
    hash.update(chunk);
  }
  return { sha256: hash.digest('hex'), census: taker.finish() };
}

export async function gzipBenchLog(plain: string, path: string): Promise<void> {
  await pipeline(createReadStream(plain, { highWaterMark: 1 << 20 }), createGzip(), createWriteStream(path));
}
