import { Router } from 'express';
import { z } from 'zod';
import type { CreateProfileRequest, CreateProfileVersionRequest } from '../../shared/api';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody } from '../http/validate-body';
import type { ProfilesService } from './profiles.service';

const parametersSchema = z.record(z.string(), z.unknown(), { error: 'must be an object of profile fields' });
const noteSchema = z.string().trim().max(2000).optional();

const createSchema = z.strictObject({
  name: z.string().trim().min(1, 'is required').max(120),
  description: z.string().trim().max(2000).optional(),
  parameters: parametersSchema,
  note: noteSchema,
});
const versionSchema = z.strictObject({ parameters: parametersSchema, note: noteSchema });

/** `/api/profiles`: everyone signed in reads; admins create profiles and new versions. */
export function profilesRoutes(profiles: ProfilesService, guards: Guards): Router {
  const router = Router();
  router.get('/', guards.requireSignIn, async (_request, response) => {
    response.json(await profiles.list());
  });
  router.get('/:id', guards.requireSignIn, async (request, response) => {
    response.json(await profiles.get(idParameter(request, 'profile')));
  });
  router.post('/', guards.requireRole('admin'), validateBody(createSchema), async (request, response) => {
    response.status(201).json(await profiles.create(request.body as CreateProfileRequest, request.user!.id));
  });
  router.post('/:id/versions', guards.requireRole('admin'), validateBody(versionSchema), async (request, response) => {
    const profile = await profiles.addVersion(idParameter(request, 'profile'), request.body as CreateProfileVersionRequest, request.user!.id);
    response.status(201).json(profile);
  });
  return router;
}
