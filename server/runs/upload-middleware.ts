import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from '../http/http-error';
import type { LogStore } from '../storage/log-store';
import { logStoreStorage, type ReceivedUpload } from './log-storage-engine';

/** The multipart field that carries the log. */
export const LOG_FIELD = 'log';

/**
 * multer for one log per request, streamed into the log store and hashed (never held in memory),
 * with multer's errors turned into sentences: 413 for a file over the limit, 400 for a wrong field.
 */
export function logUpload(store: LogStore, limitBytes: number): RequestHandler {
  const parse = multer({
    storage: logStoreStorage(store),
    limits: { fileSize: limitBytes, files: 1, fields: 20, fieldSize: 64 * 1024 },
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
      next(error);
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
