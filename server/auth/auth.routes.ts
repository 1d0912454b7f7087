import { Router } from 'express';
import { changePasswordRequestSchema, loginRequestSchema, resetPasswordRequestSchema, type LoginResponse } from '@shared/api';
import type { Config } from '../config/config';
import { HttpError } from '../http/http-error';
import { validateBody } from '../http/validate-body';
import { toUserDto, type UserRecord } from '../users/user.model';
import type { PasswordsService } from '../users/passwords.service';
import type { UsersService } from '../users/users.service';
import type { Guards } from './passport';
import { signInLimits } from './sign-in-limits';
import { issueToken } from './tokens';

/**
 * `POST /api/auth/login` (limited per client address and per account), `GET /api/auth/me`, the
 * signed-in user's own password change, and setting a password by a mailed reset link.
 */
export function authRoutes(config: Config, jwtSecret: string, users: UsersService, passwords: PasswordsService, guards: Guards): Router {
  const router = Router();
  const signedIn = (user: UserRecord): LoginResponse => {
    const { token, expiresAt } = issueToken(user, jwtSecret, config.tokenTtlSeconds);
    return { token, expiresAt: expiresAt.toISOString(), user: toUserDto(user) };
  };

  router.post('/login', validateBody(loginRequestSchema), ...signInLimits(config), async (request, response) => {
    const { email, password } = request.body;
    const user = await users.authenticate(email, password);
    if (!user) throw HttpError.unauthorized('The e-mail or the password is wrong, or the account is deactivated.');
    response.json(signedIn(user));
  });

  // A new token comes back: this session goes on, every other one ends.
  router.post('/password', guards.requireSignIn, validateBody(changePasswordRequestSchema), async (request, response) => {
    const changed = await passwords.change(request.user!, request.body.currentPassword, request.body.newPassword);
    response.json(signedIn(changed));
  });

  // Limited per address like sign-in: the secret is 256 bits, but nothing public goes unlimited.
  router.post('/password-reset', validateBody(resetPasswordRequestSchema), signInLimits(config)[0], async (request, response) => {
    await passwords.reset(request.body.secret, request.body.newPassword);
    response.status(204).end();
  });

  router.get('/me', guards.requireSignIn, (request, response) => {
    response.json(toUserDto(request.user!));
  });

  return router;
}
