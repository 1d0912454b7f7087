import { createReadStream, createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { pipeline } from 'node:stream/promises';
import { createGzip } from 'node:zlib';
import { FIXTURE_SEED, steadyPair } from '../fixtures/fixture-set';
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
export async function gzipBenchLog(plain: string, path: string): Promise<void> {
  await pipeline(createReadStream(plain, { highWaterMark: 1 << 20 }), createGzip(), createWriteStream(path));
}
