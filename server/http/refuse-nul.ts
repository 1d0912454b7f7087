import type { RequestHandler } from 'express';
import { HttpError } from './http-error';

/**
 * 400 naming the field when the query string or a JSON body holds a NUL character (U+0000):
 * PostgreSQL cannot store it in jsonb (the audit trail's details), so it would end as a 500, and
 * no field of the API has a use for it.
 */
export const refuseNulCharacters: RequestHandler = (request, _response, next) => {
  const field = nulField(request.query) ?? nulField(request.body);
  next(field === undefined ? undefined : HttpError.badRequest(`${field}: must not contain a NUL character`, field));
};

/** The dotted path of the first key or string in `value` that holds U+0000, or undefined. */
function nulField(value: unknown, path: string[] = []): string | undefined {
  if (typeof value === 'string') return value.includes('\u0000') ? path.join('.') : undefined;
  if (value === null || typeof value !== 'object') return undefined;
  for (const [key, inner] of Object.entries(value)) {
    const found = key.includes('\u0000') ? [...path, key].join('.') : nulField(inner, [...path, key]);
    if (found !== undefined) return found;
  }
  return undefined;
}
