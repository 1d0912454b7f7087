import fs from 'node:fs';
import type { RequestHandler } from 'express';
import multer from 'multer';
import { hashingDiskStorage, type HashedUpload } from '../archive/hashing-storage';
import { HttpError } from '../http/http-error';

/** The multipart field that carries the log. */
export const LOG_FIELD = 'log';

/**
 * multer for one log per request, streamed to disk and hashed (never held in memory), with
 * multer's errors turned into sentences: 413 for a file over the limit, 400 for a wrong field.
 */
export function logUpload(temporaryFolder: string, limitBytes: number): RequestHandler {
  const parse = multer({
    storage: hashingDiskStorage(temporaryFolder),
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

/** The stored upload of the request (after {@link logUpload}). */
export function uploadedLog(request: Express.Request): HashedUpload {
  return request.file as HashedUpload;
}

/** Deletes the temporary file of a request that will not become a run. */
export async function discardUpload(request: Express.Request): Promise<void> {
  if (request.file?.path) await fs.promises.rm(request.file.path, { force: true });
}
