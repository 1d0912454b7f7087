import { createHash } from 'node:crypto';
import { readingError } from '../../node/analyse-log';
import { LogSource, openSource } from '../../node/log-source';

/** A file's SHA-256 (FIPS 180-4) as stored and its size. */
export interface FileDigest {
  sha256: string;
  bytes: number;
}

/**
 * A log source that hashes its bytes as stored while a reader reads it once, so the pass that reads
 * a station log also fingerprints it. A reader that stops early (a log refused at its header) leaves
 * the rest unhashed: `digest` then reads the source again to its end. A file-system error names
 * the file (`readingError`).
 */
export class DigestingSource {
  private readonly hash = createHash('sha256');
  private bytes = 0;
  private readToEnd = false;

  constructor(readonly source: LogSource) {}

  /** The source to hand the reader; opened once. */
  get tapped(): LogSource {
    return { open: () => this.chunks() };
  }

  /** The digest of the whole source (once the reader is done; ask once). */
  async digest(): Promise<FileDigest> {
    if (!this.readToEnd) {
      const whole = new DigestingSource(this.source);
      const chunks = whole.chunks();
      while ((await chunks.next()).done !== true);
      return whole.digest();
    }
    return { sha256: this.hash.digest('hex'), bytes: this.bytes };
  }

  private async *chunks(): AsyncGenerator<Uint8Array> {
    try {
      for await (const chunk of openSource(this.source)) {
        this.hash.update(chunk);
        this.bytes += chunk.length;
        yield chunk;
      }
    } catch (error) {
      throw readingError(this.source, error);
    }
    this.readToEnd = true;
  }
}
