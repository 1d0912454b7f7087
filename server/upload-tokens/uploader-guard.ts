import type { RequestHandler } from 'express';
import { UPLOAD_TOKEN_PREFIX } from '@shared/api';
import type { Guards } from '../auth/passport';
import { HttpError } from '../http/http-error';
import type { Uploader } from './uploader';
import type { UploadTokensService } from './upload-tokens.service';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Who sends the log (set by the uploader guard). */
      uploader?: Uploader;
    }
  }
}

/**
 * The guard of the upload routes: an experimentalist signed in, or a live upload token of a setup.
 * Upload tokens pass here and nowhere else: every other route asks for a sign-in token, which an
 * upload token is not.
 */
export function uploaderGuard(guards: Guards, tokens: UploadTokensService): RequestHandler {
  const experimentalist = guards.requireRole('experimentalist');
  return (request, response, next) => {
    const bearer = /^Bearer (\S+)$/i.exec(request.get('authorization') ?? '')?.[1];
    if (bearer?.startsWith(UPLOAD_TOKEN_PREFIX)) {
      tokens.authenticate(bearer).then((token) => {
        if (!token) return next(HttpError.unauthorized('This upload token is unknown, expired or revoked.'));
        request.uploader = { kind: 'token', token: { id: token.id, name: token.name, setupId: token.setupId, station: token.station ?? null } };
        next();
      }, next);
      return;
    }
    experimentalist(request, response, (error?: unknown) => {
      if (error) return next(error);
      request.uploader = { kind: 'person', user: request.user! };
      next();
    });
  };
}
