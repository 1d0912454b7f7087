import { createHash } from 'node:crypto';
import { openSource } from './log-source';

/** SHA-256 (FIPS 180-4) of a file, hex, read as a stream; `onBytes` hears of each chunk. */
export async function hashFile(path: string, onBytes: (bytes: number) => void, cancelled: () => boolean): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of openSource({ path })) {
    if (cancelled()) {
      break;
    }
    hash.update(chunk);
    onBytes(chunk.length);
  }
  return hash.digest('hex');
}
