import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { HttpError } from './http-error';

/**
 * Replaces `request.body` with the schema's parsed value, or answers 400 naming the first bad
 * field and what is wrong with it.
 */
export function validateBody(schema: z.ZodType): RequestHandler {
  return (request, _response, next) => {
    const parsed = schema.safeParse(request.body ?? {});
    if (parsed.success) {
      request.body = parsed.data;
      return next();
    }
    next(validationError(parsed.error));
  };
}

/** A 400 naming the first bad field of a failed parse and what is wrong with it. */
export function validationError(error: z.ZodError): HttpError {
  const issue = error.issues[0];
  const field = issue.path.join('.');
  return HttpError.badRequest(field ? `${field}: ${issue.message}` : issue.message, field || undefined);
}
