import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request } from 'express';
import type multer from 'multer';

/** What the storage adds to multer's file: where the bytes went and their SHA-256. */
export interface HashedUpload extends Express.Multer.File {
  path: string;
  size: number;
  sha256: string;
}

/**
 * A multer storage engine that streams an uploaded file to a temporary file of a name of its own
 * (never the user's) and hashes it with SHA-256 on the way, so the file is read once and never
 * held in memory. A broken-off upload leaves no temporary file behind.
 */
export function hashingDiskStorage(temporaryFolder: string): multer.StorageEngine {
  return {
    _handleFile(_request: Request, file: Express.Multer.File, callback: (error?: unknown, info?: Partial<HashedUpload>) => void) {
      fs.mkdirSync(temporaryFolder, { recursive: true });
      const target = path.join(temporaryFolder, `upload-${crypto.randomUUID()}.part`);
      const hash = crypto.createHash('sha256');
      let size = 0;
      const hashing = new Transform({
        transform(chunk: Buffer, _encoding, done) {
          hash.update(chunk);
          size += chunk.length;
          done(null, chunk);
        },
      });
      pipeline(file.stream, hashing, fs.createWriteStream(target, { flags: 'wx', mode: 0o600 }))
        .then(() => callback(null, { path: target, size, sha256: hash.digest('hex') }))
        .catch((error: unknown) => {
          fs.rm(target, { force: true }, () => callback(error));
        });
    },
    _removeFile(_request: Request, file: Express.Multer.File & { path?: string }, callback: (error: Error | null) => void) {
      if (!file.path) return callback(null);
      fs.rm(file.path, { force: true }, (error) => callback(error));
    },
  };
}
