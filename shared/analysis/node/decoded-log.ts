import { Readable } from 'node:stream';
import { finished } from 'node:stream/promises';
import { createGunzip } from 'node:zlib';

/** First two bytes of every gzip member (RFC 1952). */
const GZIP_MAGIC = [0x1f, 0x8b];

/**
 * The most a gzip log may expand, and the decoded bytes always allowed before the ratio counts:
 * Apache POI's zip-bomb guard (ZipSecureFile: MIN_INFLATE_RATIO 0.01, GRACE_ENTRY_SIZE 100 KiB).
 * Round logs compress 5- to 7-fold (measured on generated logs, gzip -9); a run of one repeated
 * byte about 1000-fold, which without a bound costs a worker minutes per compressed megabyte.
 */
export const MAX_GZIP_EXPANSION = 100;
export const EXPANSION_GRACE_BYTES = 100 * 1024;

/** The decoded (decompressed when gzip) bytes of a log. */
export interface DecodedLog {
  /** Whether the raw bytes began with the gzip magic bytes. */
  gzip: boolean;
  /** The decoded bytes. */
  chunks: AsyncIterable<Uint8Array>;
}

/** Why the gzip data of a log could not be decompressed: damaged, or expanding like a decompression bomb. */
export class DamagedGzipError extends Error {}

/**
 * Decodes raw log bytes: gzip is recognised by its magic bytes, not by the file name, and
 * decompressed (all members). `onRaw` sees every raw chunk, for hashing and progress: all of
 * them, even when the gzip data fails part-way.
 */
export async function decodeLog(raw: AsyncIterable<Uint8Array>, onRaw: (chunk: Uint8Array) => void): Promise<DecodedLog> {
  const iterator: AsyncIterator<Uint8Array, unknown> = raw[Symbol.asyncIterator]();
  // The magic bytes may come in pieces of one byte: the head is joined until it holds them.
  let head: Uint8Array = new Uint8Array(0);
  let ended = false;
  while (head.length < GZIP_MAGIC.length && !ended) {
    const next = await iterator.next();
    if (next.done === true) {
      ended = true;
    } else if (next.value.length > 0) {
      head = head.length === 0 ? next.value : Buffer.concat([head, next.value]);
    }
  }
  const gzip = GZIP_MAGIC.every((byte, i) => head[i] === byte);
  async function* rawChunks(): AsyncGenerator<Uint8Array> {
    if (head.length > 0) {
      onRaw(head);
      yield head;
    }
    if (ended) {
      return;
    }
    for (let next = await iterator.next(); !next.done; next = await iterator.next()) {
      onRaw(next.value);
      yield next.value;
    }
  }
  return { gzip, chunks: gzip ? gunzipped(rawChunks()) : rawChunks() };
}

/** Whether `decoded` bytes from `compressed` expand past MAX_GZIP_EXPANSION (after the grace). */
export function expandsLikeABomb(decoded: number, compressed: number): boolean {
  return decoded > EXPANSION_GRACE_BYTES && decoded > MAX_GZIP_EXPANSION * compressed;
}

async function* gunzipped(raw: AsyncIterable<Uint8Array>): AsyncGenerator<Uint8Array> {
  const input = Readable.from(raw);
  const gunzip = createGunzip({ chunkSize: 1024 * 1024 });
  input.on('error', (error) => gunzip.destroy(error));
  input.pipe(gunzip);
  let decoded = 0;
  let problem: string | null = null;
  try {
    for await (const chunk of gunzip) {
      decoded += (chunk as Uint8Array).length;
      // bytesWritten: the compressed bytes the decoder has taken so far.
      if (expandsLikeABomb(decoded, gunzip.bytesWritten)) {
        problem = `the gzip data expands more than ${MAX_GZIP_EXPANSION}-fold (${gunzip.bytesWritten} bytes to ${decoded} so far): a decompression bomb, not a round log`;
        break;
      }
      yield chunk as Uint8Array;
    }
  } catch (error) {
    problem = `the gzip data is damaged (${(error as Error).message})`;
  }
  if (problem === null) {
    return;
  }
  await readToEnd(input);
  throw new DamagedGzipError(problem);
}

/**
 * Reads the raw bytes the decoder left, for `onRaw` alone: the result's SHA-256 and size are
 * those of the whole file as stored, which the server compares with what it archived.
 */
async function readToEnd(input: Readable): Promise<void> {
  input.unpipe();
  input.resume();
  // A failing source is the damage already reported.
  await finished(input).catch(() => undefined);
}
