import { PassThrough } from 'node:stream';
import type { Request } from 'express';
import type multer from 'multer';
import type { LogStore, ReceivedLog } from '../storage/log-store';

/** What the engine adds to multer's file: the received log, hashed, not yet kept. */
export interface ReceivedUpload extends Express.Multer.File {
  received: ReceivedLog;
}

/** The log store failed to take an upload's bytes: the server's fault (disk, bucket), never the form's. */
export class LogStoreFailure extends Error {
  constructor(readonly reason: unknown) {
    super(reason instanceof Error ? reason.message : String(reason));
    this.name = 'LogStoreFailure';
  }
}

/**
 * A multer storage engine that hands the uploaded file's stream straight to the log store, which
 * hashes it on the way (nothing held in memory; with S3 nothing on local disk). The stored name
 * never comes from the user's file name. Over the size limit busboy only cuts the file short, so
 * the engine fails the stream itself: the store then leaves nothing behind (aborting the
 * multipart upload), and multer answers with its limit error once that is done.
 */
export function logStoreStorage(store: LogStore): multer.StorageEngine {
  return {
    _handleFile(_request: Request, file: Express.Multer.File, callback: (error?: unknown, info?: Partial<ReceivedUpload>) => void) {
      const source = new PassThrough();
      file.stream.once('limit', () => {
        file.stream.unpipe(source);
        file.stream.resume();
        source.destroy(new Error('The log is larger than the upload limit.'));
      });
      file.stream.once('error', (error) => source.destroy(error));
      file.stream.pipe(source);
      store.receive(source).then(
        (received) => callback(null, { received, size: received.bytes }),
        (error: unknown) => callback(new LogStoreFailure(error)),
      );
    },
    _removeFile(_request: Request, file: Express.Multer.File & Partial<ReceivedUpload>, callback: (error: Error | null) => void) {
      if (!file.received) return callback(null);
      file.received.drop().then(() => callback(null), callback);
    },
  };
}
