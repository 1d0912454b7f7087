import { Router } from 'express';
import { createProfileRequestSchema, createProfileVersionRequestSchema } from '@shared/api';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody } from '../http/validate-body';
import type { ProfilesService } from './profiles.service';

/** `/api/profiles`: everyone signed in reads; admins create profiles and new versions. */
export function profilesRoutes(profiles: ProfilesService, guards: Guards): Router {
  const router = Router();
  router.get('/', guards.requireSignIn, async (_request, response) => {
    response.json(await profiles.list());
  });
  router.get('/:id', guards.requireSignIn, async (request, response) => {
    response.json(await profiles.get(idParameter(request, 'profile')));
  });
  router.post('/', guards.requireRole('admin'), validateBody(createProfileRequestSchema), async (request, response) => {
    response.status(201).json(await profiles.create(request.body, request.user!.id));
  });
  router.post('/:id/versions', guards.requireRole('admin'), validateBody(createProfileVersionRequestSchema), async (request, response) => {
    const profile = await profiles.addVersion(idParameter(request, 'profile'), request.body, request.user!.id);
    response.status(201).json(profile);
  });
  return router;
}
