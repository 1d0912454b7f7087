import type { Request, RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Config } from '../config/config';
import { HttpError } from '../http/http-error';

/** "in 14 minutes (at 16:05 UTC)": when a limited client may try again. */
function whenToTryAgain(request: Request): string {
  const reset = (request as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
  if (!reset) return 'in a few minutes';
  const minutes = Math.max(1, Math.ceil((reset.getTime() - Date.now()) / 60_000));
  return `in ${minutes} minute${minutes === 1 ? '' : 's'} (at ${reset.toISOString().slice(11, 16)} UTC)`;
}

/**
 * The two limits on `POST /api/auth/login`: every attempt counts against the client's address
 * (IPv6 by /56, as express-rate-limit groups it), and each failed one also against the account
 * named, from whatever address it came, so spreading a password guess over many addresses does
 * not help. A refusal is a 429 that says when to try again.
 */
export function signInLimits(config: Config): RequestHandler[] {
  const { limit, accountLimit, windowSeconds } = config.loginRateLimit;
  const common = { windowMs: windowSeconds * 1000, standardHeaders: 'draft-8', legacyHeaders: false } as const;
  const perAddress = rateLimit({
    ...common,
    limit,
    identifier: 'address',
    handler: (request, _response, next) => next(new HttpError(429, 'rate-limited', `Too many sign-in attempts from this address; try again ${whenToTryAgain(request)}.`)),
  });
  const perAccount = rateLimit({
    ...common,
    limit: accountLimit,
    identifier: 'account',
    skipSuccessfulRequests: true,
    keyGenerator: (request) => {
      const email = (request.body as { email?: unknown } | undefined)?.email;
      return typeof email === 'string' ? email.trim().toLowerCase() : '';
    },
    handler: (request, _response, next) =>
      next(new HttpError(429, 'rate-limited', `Too many failed sign-ins for this account; try again ${whenToTryAgain(request)}, or ask an admin.`)),
  });
  return [perAddress, perAccount];
}
