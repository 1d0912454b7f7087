import { PassThrough, pipeline, type Readable } from 'node:stream';
import type { LogCensus } from '@shared/analysis';
import type { Request } from 'express';
import type multer from 'multer';
import { HttpError, isDiskFull } from '../http/http-error';
import type { LogStore, ReceivedLog } from '../storage/log-store';
import { faultLines } from '../system/fault-lines';
import { CensusTap } from './census-tap';

/** An uploaded log, received and hashed, not yet kept, with the census taken on the way (null when none could be). */
export interface ReceivedRunLog extends ReceivedLog {
  census: LogCensus | null;
}

/** What the engine adds to multer's file: the received log. */
export interface ReceivedUpload extends Express.Multer.File {
  received: ReceivedRunLog;
}

/** The log store failed to take an upload's bytes: the server's fault (disk, bucket), never the form's. */
export class LogStoreFailure extends Error {
  constructor(readonly reason: unknown) {
    super(reason instanceof Error ? reason.message : String(reason));
    this.name = 'LogStoreFailure';
  }
}

const diskFaults = faultLines('Archive');

/** What became of an upload's bytes when the disk filled: thrown away, or kept so the upload can go on (tus). */
type BytesOnFullDisk = 'dropped' | 'kept';

/**
 * An upload that met a full disk or quota, as a 507 saying what became of its bytes and where to
 * free space; any other error as it is. The folder is named by its setting, not its path: the
 * uploader passes the sentence on, and whoever runs the server knows where that is.
 */
export function diskFullAnswer(error: unknown, bytes: BytesOnFullDisk): unknown {
  if (!isDiskFull(error)) return error;
  diskFaults(error); // in the server's output too: tus answers its errors itself, past the error handler
  const [became, then] = bytes === 'kept' ? ['the bytes received so far are kept', 'go on with the upload'] : ['the log was not kept', 'upload again'];
  return HttpError.insufficientStorage(`The archive's disk is full: ${became}; free space in the server's data folder (BELLKEEP_DATA_DIR) and ${then}.`);
}

/**
 * Receives an upload's log into the store, for multipart and resumable uploads alike, taking its
 * census on the way (CensusTap). A full disk while receiving or keeping it becomes a 507 saying the
 * log was not kept (the store leaves nothing of a failed receive behind, and a log not kept is
 * dropped by its caller).
 */
export async function receiveUpload(store: LogStore, source: Readable): Promise<ReceivedRunLog> {
  const notKept = (error: unknown): never => {
    throw diskFullAnswer(error, 'dropped');
  };
  const tap = new CensusTap();
  // A source that fails destroys the tap with its error, so the store's own pipeline fails too.
  pipeline(source, tap, () => undefined);
  const received = await store.receive(tap).catch(notKept);
  return { ...received, census: tap.census, keep: () => received.keep().catch(notKept) };
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
      // The store pipes the source only after an await (its folder, its bucket); an error before
      // that (the limit, a broken-off request) would go unhandled and end the process. Its
      // pipeline still sees the error, as the stream's own.
      source.on('error', () => undefined);
      file.stream.once('limit', () => {
        file.stream.unpipe(source);
        file.stream.resume();
        source.destroy(new Error('The log is larger than the upload limit.'));
      });
      file.stream.once('error', (error) => source.destroy(error));
      file.stream.pipe(source);
      receiveUpload(store, source).then(
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
