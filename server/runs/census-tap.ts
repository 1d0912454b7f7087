import { Transform, type TransformCallback } from 'node:stream';
import zlib from 'node:zlib';
import { type LogCensus, LogCensusTaker } from '@shared/analysis';
import { createLineCounter, expandsLikeABomb } from '@shared/analysis/node';

const GZIP_MAGIC = [0x1f, 0x8b];

/**
 * Passes an upload's bytes through unchanged while taking the log's census (lines, records and
 * marks every few MiB of text; see LogCensus), so the worker's analysis needs no counting pass of
 * its own. A gzip log (known by its magic bytes, not its name) is decompressed beside the upload
 * for this, under the engine's guard against decompression bombs: past it the decompression stops.
 * The census is a help, never a condition: bytes that are no readable gzip, a bomb, or a census
 * that fails give `null`, and the upload goes on; the analysis then counts for itself and reports
 * the log's problem.
 */
export class CensusTap extends Transform {
  private taker: LogCensusTaker | null = new LogCensusTaker(undefined, createLineCounter());
  private head: Buffer | null = Buffer.alloc(0);
  private gunzip: zlib.Gunzip | null = null;
  private gunzipEnded: Promise<void> = Promise.resolve();

  /** The census, once the stream has ended; null when none could be taken. */
  census: LogCensus | null = null;

  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback): void {
    this.push(chunk);
    if (this.head !== null) {
      this.head = Buffer.concat([this.head, chunk]);
      if (this.head.length < GZIP_MAGIC.length) return done();
      const bytes = this.head;
      this.head = null;
      if (GZIP_MAGIC.every((byte, i) => bytes[i] === byte)) this.startGunzip();
      return this.feed(bytes, done);
    }
    this.feed(chunk, done);
  }

  override _flush(done: TransformCallback): void {
    const finish = () => {
      this.census = this.taker?.finish() ?? null;
      done();
    };
    if (this.head !== null) {
      // Fewer bytes than a gzip magic: plain text.
      const bytes = this.head;
      this.head = null;
      return this.feed(bytes, finish);
    }
    if (this.gunzip === null) return finish();
    if (!this.gunzip.destroyed) this.gunzip.end();
    void this.gunzipEnded.then(finish);
  }

  /** Plain bytes go to the census at once; gzip bytes through the decompressor, waiting for it to keep up. */
  private feed(bytes: Buffer, done: () => void): void {
    if (this.gunzip === null) {
      this.count(bytes);
      return done();
    }
    if (this.gunzip.destroyed || this.gunzip.write(bytes)) return done();
    this.gunzip.once('drain', done);
  }

  private startGunzip(): void {
    const gunzip = zlib.createGunzip();
    this.gunzip = gunzip;
    let decoded = 0;
    this.gunzipEnded = new Promise((resolve) => {
      // No census; a destroyed stream emits no 'drain', so a write waiting for one is released.
      const giveUp = () => {
        this.taker = null;
        gunzip.emit('drain');
        resolve();
      };
      gunzip.on('data', (text: Buffer) => {
        decoded += text.length;
        if (!expandsLikeABomb(decoded, gunzip.bytesWritten)) return this.count(text);
        gunzip.destroy();
        giveUp();
      });
      gunzip.once('end', resolve);
      gunzip.on('error', giveUp);
    });
  }

  private count(text: Buffer): void {
    try {
      this.taker?.push(text);
    } catch {
      this.taker = null;
    }
  }
}
