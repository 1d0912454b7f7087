import type { RequestHandler } from 'express';
import { Passport } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { Role } from '@shared/api';
import { ROLE_LABELS } from '@shared/api';
import { HttpError } from '../http/http-error';
import type { UserRecord } from '../users/user.model';
import type { UsersService } from '../users/users.service';
import { TOKEN_ALGORITHM, TOKEN_ISSUER, type TokenClaims } from './tokens';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport puts the signed-in user here (declaration merging needs an interface, empty as it is).
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserRecord {}
  }
}

export interface Guards {
  /** 401 unless the request carries a valid token of an active user. */
  requireSignIn: RequestHandler;
  /** 401 without sign-in; 403 unless the user holds one of `roles`. */
  requireRole(...roles: Role[]): RequestHandler;
}

/**
 * Bearer-token sign-in with passport-jwt. The user is loaded on every request, so deactivating
 * someone stops their tokens at once.
 */
export function createGuards(secret: string, users: UsersService): Guards {
  const passport = new Passport();
  passport.use(
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
        secretOrKey: secret,
        issuer: TOKEN_ISSUER,
        algorithms: [TOKEN_ALGORITHM],
      },
      (payload: TokenClaims, done: (error: unknown, user?: UserRecord | false) => void) => {
        users
          .findActiveById(Number(payload.sub))
          // A token from before the last password change is refused: changing it ends the other sessions.
          .then((user) => done(null, user !== null && user.passwordVersion === (payload.pv ?? 0) ? user : false))
          .catch((error: unknown) => done(error));
      },
    ),
  );

  const requireSignIn: RequestHandler = (request, response, next) => {
    const authenticate = passport.authenticate('jwt', { session: false }, (error: unknown, user: UserRecord | false) => {
      if (error) return next(error);
      if (!user) return next(HttpError.unauthorized());
      request.user = user;
      next();
    }) as RequestHandler;
    void authenticate(request, response, next);
  };

  const requireRole = (...roles: Role[]): RequestHandler => {
    const allowed = roles.map((role) => ROLE_LABELS[role]).join(' or ');
    return (request, response, next) => {
      requireSignIn(request, response, (error?: unknown) => {
        if (error) return next(error);
        if (roles.some((role) => request.user!.roles.includes(role))) return next();
        next(HttpError.forbidden(`This needs the ${allowed} role.`));
      });
    };
  };

  return { requireSignIn, requireRole };
}
