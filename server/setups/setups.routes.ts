import { Router } from 'express';
import { saveColumnMappingRequestSchema, saveSetupRequestSchema } from '@shared/api';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody } from '../http/validate-body';
import type { SetupsService } from './setups.service';

/** `/api/setups`: everyone signed in reads; admins create and edit; those who upload save a column mapping. */
export function setupsRoutes(setups: SetupsService, guards: Guards): Router {
  const router = Router();
  router.get('/', guards.requireSignIn, async (_request, response) => {
    response.json(await setups.list());
  });
  router.get('/:id', guards.requireSignIn, async (request, response) => {
    response.json(await setups.get(idParameter(request, 'setup')));
  });
  router.post('/', guards.requireRole('admin'), validateBody(saveSetupRequestSchema), async (request, response) => {
    response.status(201).json(await setups.create(request.body, request.user!.id));
  });
  router.put('/:id', guards.requireRole('admin'), validateBody(saveSetupRequestSchema), async (request, response) => {
    response.json(await setups.update(idParameter(request, 'setup'), request.body, request.user!.id));
  });
  router.put('/:id/column-mapping', guards.requireRole('experimentalist', 'admin'), validateBody(saveColumnMappingRequestSchema), async (request, response) => {
    response.json(await setups.saveColumnMapping(idParameter(request, 'setup'), request.body.mapping, request.user!.id));
  });
  return router;
}
