import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from '../http/http-error';
import type { LogStore } from '../storage/log-store';
import { LogStoreFailure, logStoreStorage, type ReceivedUpload } from './log-storage-engine';

/** The multipart field that carries the log. */
export const LOG_FIELD = 'log';

/**
 * multer for one log per request, streamed into the log store and hashed (never held in memory),
 * with multer's errors turned into sentences: 413 for a file over the limit, 400 for a wrong field
 * or a body that is no well-formed form (busboy's errors); a full disk is a 507 (see
 * `diskFullAnswer`), and the log store's other failures stay 500s.
 */
export function logUpload(store: LogStore, limitBytes: number): RequestHandler {
  const parse = multer({
    storage: logStoreStorage(store),
    limits: { fileSize: limitBytes, files: 1, fields: 20, fieldSize: 64 * 1024 },
    // Browsers write a file name in UTF-8 (the HTML standard's multipart/form-data encoding);
    // busboy's default, Latin-1, turns "ночь-42.csv" into "Ð½Ð¾ÑÑ-42.csv".
    defParamCharset: 'utf8',
  }).single(LOG_FIELD);
  return (request, response, next) => {
    parse(request, response, (error?: unknown) => {
      if (!error) {
        if (!request.file) return next(HttpError.badRequest(`Attach the round log in the form field "${LOG_FIELD}".`, LOG_FIELD));
        return next();
      }
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          return next(new HttpError(413, 'validation', `The log is larger than the upload limit of ${limitBytes} bytes.`, LOG_FIELD));
        }
        return next(HttpError.badRequest(`${error.message}${error.field ? ` (field "${error.field}")` : ''}.`, error.field));
      }
      if (error instanceof LogStoreFailure) return next(error.reason);
      // busboy's: a part header with a control character (a file name with a NUL byte), a cut-off body.
      next(HttpError.badRequest(`The upload is no well-formed multipart form: ${(error as Error).message}.`));
    });
  };
}

/** The received upload of the request (after {@link logUpload}). */
export function uploadedLog(request: Express.Request): ReceivedUpload {
  return request.file as ReceivedUpload;
}

/** Drops the received log of a request that did not become a run (nothing happens once it was kept). */
export async function discardUpload(request: Express.Request): Promise<void> {
  await (request.file as Partial<ReceivedUpload> | undefined)?.received?.drop();
}
