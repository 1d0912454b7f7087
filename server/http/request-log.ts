import crypto from 'node:crypto';
import type { RequestHandler } from 'express';
import { pinoHttp } from 'pino-http';
import { log, requestContext } from '../system/log';

/** A request id a proxy may send along: letters, digits, dashes; anything else gets one of ours. */
const FORWARDED_ID = /^[A-Za-z0-9-]{8,64}$/;

/**
 * Gives every request an id (a proxy's `X-Request-Id` if it is well formed, else a new UUID), says
 * it in the answer's `X-Request-Id`, logs each request once it is answered (method, path, status,
 * time: no headers, no body, so no token or password), and runs the rest of the request inside
 * that id's context: the queue jobs it makes carry it on to the worker and the mail.
 */
export function requestLog(): RequestHandler[] {
  const http = pinoHttp({
    logger: log,
    genReqId: (request, response) => {
      const forwarded = request.headers['x-request-id'];
      const id = typeof forwarded === 'string' && FORWARDED_ID.test(forwarded) ? forwarded : crypto.randomUUID();
      response.setHeader('X-Request-Id', id);
      return id;
    },
    serializers: {
      req: (request: { id: string; method: string; url: string }) => ({ id: request.id, method: request.method, path: request.url.split('?')[0] }),
      res: (response: { statusCode: number }) => ({ status: response.statusCode }),
    },
    // The request id comes from the context (the log's mixin); no second copy.
    quietReqLogger: true,
    customLogLevel: (_request, response, error) => (error || response.statusCode >= 500 ? 'error' : response.statusCode >= 400 ? 'warn' : 'info'),
  });
  const inContext: RequestHandler = (request, _response, next) =>
    requestContext.run({ requestId: typeof request.id === 'object' ? JSON.stringify(request.id) : String(request.id) }, next);
  return [http, inContext];
}
