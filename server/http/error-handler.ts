import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '@shared/api';
import { faultLines, isDatabaseUnreachable, oneLine } from '../system/fault-lines';
import { log } from '../system/log';
import { HttpError } from './http-error';

/** Unknown API routes answer in the same JSON shape as every other error. */
export const apiNotFound: RequestHandler = (request, _response, next) => {
  next(HttpError.notFound(`No API route ${request.method} ${request.originalUrl}.`));
};

/** The one error handler: the last middleware of the app. */
export const errorHandler: ErrorRequestHandler = (error, request, response, _next) => {
  // The client went away mid-request (an upload broken off): nobody is left to answer.
  if (request.socket.destroyed || response.headersSent) return;
  const httpError = toHttpError(error);
  if (httpError.status >= 500) reportFault(error, `${request.method} ${request.originalUrl}`);
  const body: ApiErrorBody = {
    error: { code: httpError.code, message: httpError.message, ...(httpError.field ? { field: httpError.field } : {}) },
  };
  response.status(httpError.status).json(body);
};

const apiFaults = faultLines('API');

/**
 * A server error in one line (counted when the same one repeats, as while the database restarts);
 * an unforeseen error also gets its stack, which is what finds it.
 */
function reportFault(error: unknown, route: string): void {
  // The database away, or a server error the code words itself (a full archive disk: 507): known conditions, not bugs.
  if (isDatabaseUnreachable(error) || error instanceof HttpError || !(error instanceof Error)) apiFaults(error);
  else console.error(`API: ${route}: ${error.stack ?? oneLine(error)}`);
  log.error({ route, error: oneLine(error), stack: error instanceof Error ? error.stack : undefined }, 'server error');
}

function toHttpError(error: unknown): HttpError {
  if (error instanceof HttpError) return error;
  // body-parser's errors carry a status and a type: malformed JSON, a body too large.
  const status = (error as { status?: number }).status;
  if (status && status >= 400 && status < 500) {
    const type = (error as { type?: string }).type;
    const message = type === 'entity.parse.failed' ? 'The request body is not valid JSON.' : (error as Error).message;
    return new HttpError(status, 'validation', message);
  }
  return new HttpError(500, 'internal', 'Something went wrong on the server; it has been logged.');
}
