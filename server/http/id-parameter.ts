import type { Request } from 'express';
import { HttpError } from './http-error';

/** The positive integer `:id` (or another named parameter) of the route, or 400 naming it. */
export function idParameter(request: Request, what: string, name = 'id'): number {
  const raw = request.params[name];
  const id = Number(raw);
  if (typeof raw !== 'string' || !/^[1-9]\d{0,9}$/.test(raw) || !Number.isSafeInteger(id)) {
    throw HttpError.badRequest(`The ${what} id ${JSON.stringify(raw)} is not a positive whole number.`, name);
  }
  return id;
}
