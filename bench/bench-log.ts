import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { Writable } from 'node:stream';
import { createGzip } from 'node:zlib';
import { acquireRun } from '../fixtures/device-model';
import { FIXTURE_SEED, steadyPair } from '../fixtures/fixture-set';

/** Writes a log of `rounds` rounds from the Kestrel Fen model to `path`, gzip-compressed when asked. */
export async function writeBenchLog(path: string, rounds: number, gzip: boolean): Promise<void> {
  const file = createWriteStream(path);
  const gzipper = gzip ? createGzip() : null;
  gzipper?.pipe(file);
  const out: Writable = gzipper ?? file;
  const lines: string[] = ['round,x,y,a,b'];
  for (const r of acquireRun({ ...steadyPair, rounds }, FIXTURE_SEED)) {
    lines.push(`${r.round},${r.x},${r.y},${r.a},${r.b}`);
    if (lines.length === 65_536) {
      if (!out.write(lines.join('\n') + '\n')) {
        await once(out, 'drain');
      }
      lines.length = 0;
    }
  }
  out.end(lines.length > 0 ? lines.join('\n') + '\n' : '');
  await once(file, 'finish');
}
