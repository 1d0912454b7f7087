import crypto from 'node:crypto';
import { Transform, type TransformCallback } from 'node:stream';
import { StoredLogCorruptError } from './log-store';

/**
 * Passes bytes through unchanged while taking their SHA-256 (FIPS 180-4) and count. Given an
 * expected hash, it ends with an error instead of `end` when the bytes do not hash to it, so a
 * reader that waits for the end (a pipeline) never takes changed bytes for the stored log.
 */
export class DigestStream extends Transform {
  private readonly hash = crypto.createHash('sha256');
  private counted = 0;
  private digest?: string;

  constructor(private readonly expected?: { sha256: string; location: string }) {
    super();
  }

  /** Bytes passed so far. */
  get bytes(): number {
    return this.counted;
  }

  /** The SHA-256 in hex, once the stream has ended. */
  get sha256(): string {
    if (this.digest === undefined) throw new Error('The digest is known only once the stream has ended.');
    return this.digest;
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback): void {
    this.hash.update(chunk);
    this.counted += chunk.length;
    done(null, chunk);
  }

  override _flush(done: TransformCallback): void {
    this.digest = this.hash.digest('hex');
    if (this.expected && this.digest !== this.expected.sha256) {
      return done(new StoredLogCorruptError(this.expected.location, `its bytes hash to ${this.digest}, not to its name ${this.expected.sha256}`, this.digest));
    }
    done();
  }
}
