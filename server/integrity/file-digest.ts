import crypto from 'node:crypto';
import fs from 'node:fs';

/** SHA-256 (FIPS 180-4) and size of a file, read as a stream (archived logs run to gigabytes). */
export async function digestFile(file: string): Promise<{ sha256: string; bytes: number }> {
  const hash = crypto.createHash('sha256');
  let bytes = 0;
  for await (const chunk of fs.createReadStream(file) as AsyncIterable<Buffer>) {
    bytes += chunk.length;
    hash.update(chunk);
  }
  return { sha256: hash.digest('hex'), bytes };
}
