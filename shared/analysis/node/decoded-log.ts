import { Readable } from 'node:stream';
import { createGunzip } from 'node:zlib';

/** First two bytes of every gzip member (RFC 1952). */
const GZIP_MAGIC = [0x1f, 0x8b];

/** The decoded (decompressed when gzip) bytes of a log. */
export interface DecodedLog {
  /** Whether the raw bytes began with the gzip magic bytes. */
  gzip: boolean;
  /** The decoded bytes. */
  chunks: AsyncIterable<Uint8Array>;
}

/** Why the gzip data of a log could not be decompressed. */
export class DamagedGzipError extends Error {}

/**
 * Decodes raw log bytes: gzip is recognised by its magic bytes, not by the file name, and
 * decompressed (all members). `onRaw` sees every raw chunk, for hashing and progress.
 */
export async function decodeLog(raw: AsyncIterable<Uint8Array>, onRaw: (chunk: Uint8Array) => void): Promise<DecodedLog> {
  const iterator = raw[Symbol.asyncIterator]();
  let first = await iterator.next();
  while (!first.done && first.value.length === 0) {
    first = await iterator.next();
  }
  const head = first.done ? new Uint8Array(0) : first.value;
  const gzip = GZIP_MAGIC.every((byte, i) => head[i] === byte);
  async function* rawChunks(): AsyncGenerator<Uint8Array> {
    if (first.done) {
      return;
    }
    onRaw(head);
    yield head;
    for (let next = await iterator.next(); !next.done; next = await iterator.next()) {
      onRaw(next.value);
      yield next.value;
    }
  }
  return { gzip, chunks: gzip ? gunzipped(rawChunks()) : rawChunks() };
}

async function* gunzipped(raw: AsyncIterable<Uint8Array>): AsyncGenerator<Uint8Array> {
  const input = Readable.from(raw);
  const gunzip = createGunzip({ chunkSize: 1024 * 1024 });
  input.on('error', (error) => gunzip.destroy(error));
  input.pipe(gunzip);
  try {
    for await (const chunk of gunzip) {
      yield chunk as Uint8Array;
    }
  } catch (error) {
    throw new DamagedGzipError(`the gzip data is damaged (${(error as Error).message})`);
  }
}
