import { Router } from 'express';
import { loginRequestSchema, type LoginResponse } from '@shared/api';
import type { Config } from '../config/config';
import { HttpError } from '../http/http-error';
import { validateBody } from '../http/validate-body';
import { toUserDto } from '../users/user.model';
import type { UsersService } from '../users/users.service';
import type { Guards } from './passport';
import { signInLimits } from './sign-in-limits';
import { issueToken } from './tokens';

/** `POST /api/auth/login` (limited per client address and per account) and `GET /api/auth/me`. */
export function authRoutes(config: Config, jwtSecret: string, users: UsersService, guards: Guards): Router {
  const router = Router();

  router.post('/login', validateBody(loginRequestSchema), ...signInLimits(config), async (request, response) => {
    const { email, password } = request.body;
    const user = await users.authenticate(email, password);
    if (!user) throw HttpError.unauthorized('The e-mail or the password is wrong, or the account is deactivated.');
    const { token, expiresAt } = issueToken(user.id, jwtSecret, config.tokenTtlSeconds);
    const body: LoginResponse = { token, expiresAt: expiresAt.toISOString(), user: toUserDto(user) };
    response.json(body);
  });

  router.get('/me', guards.requireSignIn, (request, response) => {
    response.json(toUserDto(request.user!));
  });

  return router;
}
