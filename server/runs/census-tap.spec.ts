import fs from 'node:fs';
import path from 'node:path';
import { Readable } from 'node:stream';
import { buffer } from 'node:stream/consumers';
import zlib from 'node:zlib';
import fc from 'fast-check';
import { LogCensusTaker } from '@shared/analysis';
import '@tests/support/property-seed';
import { CensusTap } from './census-tap';

const LOG = fs.readFileSync(path.join(__dirname, '..', '..', 'fixtures', 'logs', 'accepted-run.csv'));

/** The bytes cut at the given places, as a stream. */
function piecesOf(bytes: Buffer, cuts: number[]): Readable {
  const at = [...new Set([0, ...cuts.map((cut) => cut % bytes.length), bytes.length])].sort((a, b) => a - b);
  return Readable.from(at.slice(1).map((end, i) => bytes.subarray(at[i], end)));
}

/** Streams `source` through a tap: what came out, and the census. */
async function tapped(source: Readable): Promise<{ out: Buffer; tap: CensusTap }> {
  const tap = new CensusTap();
  const out = await buffer(source.pipe(tap));
  return { out, tap };
}

/** The census of the whole text in one piece. */
function censusOfText(text: Buffer) {
  const taker = new LogCensusTaker();
  taker.push(text);
  return taker.finish();
}

describe('the census an upload takes on the way', () => {
  it('passes the bytes through unchanged and counts a plain log however it is cut', async () => {
    const expected = censusOfText(LOG);
    expect(expected.records).toBe(
      LOG.toString('latin1')
        .split('\n')
        .filter((line) => line.trim() !== '').length,
    );
    await fc.assert(
      fc.asyncProperty(fc.array(fc.nat(), { maxLength: 12 }), async (cuts) => {
        const { out, tap } = await tapped(piecesOf(LOG, cuts));
        expect(out.equals(LOG)).toBe(true);
        expect(tap.census).toEqual(expected);
      }),
      { numRuns: 25 },
    );
  });

  it('counts the text of a gzip log, known by its magic bytes even when the first piece holds one byte', async () => {
    const gzipped = zlib.gzipSync(LOG);
    const { out, tap } = await tapped(piecesOf(gzipped, [1, 2, 7, 1000]));
    expect(out.equals(gzipped)).toBe(true);
    expect(tap.census).toEqual(censusOfText(LOG));
    expect(tap.census!.decodedBytes).toBe(LOG.length);
  });

  it('gives no census for bytes that are no readable gzip, and still passes them all through', async () => {
    const cut = zlib.gzipSync(LOG).subarray(0, 5000);
    const { out, tap } = await tapped(piecesOf(cut, [100, 2000]));
    expect(out.equals(cut)).toBe(true);
    expect(tap.census).toBeNull();
  });

  it('stops decompressing a gzip bomb at the engine’s expansion limit: no census, every byte passed on', async () => {
    // 64 MiB of line breaks: read whole, they would make a census of 64 Mi blank lines.
    const bomb = zlib.gzipSync(Buffer.alloc(64 * 1024 * 1024, 10));
    const { out, tap } = await tapped(piecesOf(bomb, [1000, 5000]));
    expect(out.equals(bomb)).toBe(true);
    expect(tap.census).toBeNull();
  });

  it('counts a log shorter than the gzip magic as plain text', async () => {
    const { tap } = await tapped(Readable.from([Buffer.from('x')]));
    expect(tap.census).toEqual(censusOfText(Buffer.from('x')));
  });
});
