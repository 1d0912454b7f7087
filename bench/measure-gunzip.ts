import { createReadStream } from 'node:fs';
import { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGunzip } from 'node:zlib';

// Decompression alone, the floor for a gzip log: `node dist/server/measure-gunzip.js <log.gz>`
// streams the file through zlib to nowhere, with the engine's chunk sizes, and prints
// {seconds, peakMB, rounds: 0} as JSON.
async function main(): Promise<void> {
  const started = process.hrtime.bigint();
  await pipeline(
    createReadStream(process.argv[2], { highWaterMark: 4 * 1024 * 1024 }),
    createGunzip({ chunkSize: 1024 * 1024 }),
    new Writable({ write: (_chunk, _encoding, done) => done() }),
  );
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  process.stdout.write(JSON.stringify({ seconds, peakMB: process.resourceUsage().maxRSS / 1024, rounds: 0 }) + '\n');
}

void main();
