import { Router } from 'express';
import { z } from 'zod';
import { MIN_PASSWORD_LENGTH, ROLES, type CreateUserRequest, type UpdateUserRequest } from '../../shared/api';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody } from '../http/validate-body';
import type { AppMail } from '../mail/app-mail';
import type { UsersService } from './users.service';

const rolesSchema = z.array(z.enum(ROLES)).min(1, 'needs at least one role');
const nameSchema = z.string().trim().min(1, 'is required').max(200);

const createSchema = z.strictObject({
  email: z.string().trim().max(320).pipe(z.email('is not an e-mail address')),
  name: nameSchema,
  password: z.string().min(MIN_PASSWORD_LENGTH, `must be at least ${MIN_PASSWORD_LENGTH} characters`).max(200),
  roles: rolesSchema,
});

const updateSchema = z
  .strictObject({ name: nameSchema.optional(), roles: rolesSchema.optional(), active: z.boolean().optional() })
  .refine((body) => Object.keys(body).length > 0, 'give at least one of name, roles, active');

/** Admin-only user management under `/api/users`. */
export function usersRoutes(users: UsersService, guards: Guards, appMail: AppMail): Router {
  const router = Router();
  router.use(guards.requireRole('admin'));

  router.get('/', async (_request, response) => {
    response.json(await users.list());
  });

  router.post('/', validateBody(createSchema), async (request, response) => {
    const created = await users.create(request.body as CreateUserRequest, request.user!.id);
    appMail.welcome(created, request.user!.name);
    response.status(201).json(created);
  });

  router.patch('/:id', validateBody(updateSchema), async (request, response) => {
    const id = idParameter(request, 'user');
    response.json(await users.update(id, request.body as UpdateUserRequest, request.user!.id));
  });

  return router;
}
