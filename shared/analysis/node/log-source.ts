import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import { AnalysisRequestError } from './analysis-errors';

/**
 * A round log to analyse: a file (read `readBytes` at a time, default `READ_CHUNK_BYTES`), or a
 * stream that can be opened twice (counting pass, then analysis).
 */
export type LogSource = { path: string; readBytes?: number } | { open: () => AsyncIterable<Uint8Array>; bytes?: number };

/** Read size for files. */
export const READ_CHUNK_BYTES = 4 * 1024 * 1024;

/** Opens the source from its first byte. */
export function openSource(source: LogSource): AsyncIterable<Uint8Array> {
  return 'path' in source ? createReadStream(source.path, { highWaterMark: source.readBytes ?? READ_CHUNK_BYTES }) : source.open();
}

/** The size of the source in bytes, when known in advance. */
export async function sourceBytes(source: LogSource): Promise<number | null> {
  if (!('path' in source)) {
    return source.bytes ?? null;
  }
  try {
    const info = await stat(source.path);
    if (!info.isFile()) {
      throw new AnalysisRequestError(`${source.path} is not a file`, 'io');
    }
    return info.size;
  } catch (error) {
    if (error instanceof AnalysisRequestError) {
      throw error;
    }
    throw new AnalysisRequestError(`cannot read ${source.path}: ${(error as Error).message}`, 'io');
  }
}
