import type { Request, RequestHandler } from 'express';
import type { ParamsDictionary } from 'express-serve-static-core';
import type { z } from 'zod';
import { HttpError } from './http-error';

/**
 * Replaces `request.body` with the contract's parsed value (typed so for the handlers after it),
 * or answers 400 naming the first bad field and what is wrong with it.
 */
export function validateBody<Contract extends z.ZodType>(contract: Contract): RequestHandler<ParamsDictionary, unknown, z.output<Contract>> {
  return (request, _response, next) => {
    const parsed = contract.safeParse(request.body ?? {});
    if (parsed.success) {
      request.body = parsed.data;
      return next();
    }
    next(validationError(parsed.error));
  };
}

/** The request's query string parsed by its contract, or a 400 naming the first bad parameter. */
export function validQuery<Contract extends z.ZodType>(contract: Contract, request: Request): z.output<Contract> {
  const parsed = contract.safeParse(request.query);
  if (!parsed.success) throw validationError(parsed.error);
  return parsed.data;
}

/** A 400 naming the first bad field of a failed parse and what is wrong with it. */
export function validationError(error: z.ZodError): HttpError {
  const issue = error.issues[0];
  const field = issue.path.join('.');
  return HttpError.badRequest(field ? `${field}: ${issue.message}` : issue.message, field || undefined);
}
