import { Router } from 'express';
import { createUserRequestSchema, updateUserRequestSchema } from '@shared/api';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody } from '../http/validate-body';
import type { AppMail } from '../mail/app-mail';
import type { PasswordsService } from './passwords.service';
import type { UsersService } from './users.service';

/** Admin-only user management under `/api/users`, with the password reset links admins mail. */
export function usersRoutes(users: UsersService, passwords: PasswordsService, guards: Guards, appMail: AppMail): Router {
  const router = Router();
  router.use(guards.requireRole('admin'));

  router.get('/', async (_request, response) => {
    response.json(await users.list());
  });

  router.post('/', validateBody(createUserRequestSchema), async (request, response) => {
    const created = await users.create(request.body, request.user!.id);
    appMail.welcome(created, request.user!.name);
    response.status(201).json(created);
  });

  router.patch('/:id', validateBody(updateUserRequestSchema), async (request, response) => {
    const id = idParameter(request, 'user');
    response.json(await users.update(id, request.body, request.user!.id));
  });

  router.post('/:id/password-reset-link', async (request, response) => {
    const admin = request.user!;
    const sent = await passwords.mailResetLink(idParameter(request, 'user'), admin, (user, secret, expiresAt) => appMail.passwordResetLink(user, secret, expiresAt, admin.name));
    response.status(201).json(sent);
  });

  return router;
}
