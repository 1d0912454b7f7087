import { Router } from 'express';
import { z } from 'zod';
import type { SaveSetupRequest } from '../../shared/api';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody } from '../http/validate-body';
import type { SetupsService } from './setups.service';

const label = z.string().trim().min(1, 'is required').max(120);
const saveSchema = z.strictObject({
  name: label,
  description: z.string().trim().max(2000).optional(),
  stationALabel: label,
  stationBLabel: label,
  defaultProfileId: z.number({ error: 'must be a profile id' }).int().positive(),
  shiftLeadIds: z.array(z.number().int().positive(), { error: 'must be a list of user ids' }).max(50),
  extraRecipients: z.array(z.string().trim().pipe(z.email('is not an e-mail address'))).max(50).optional(),
});

/** `/api/setups`: everyone signed in reads; admins create and edit. */
export function setupsRoutes(setups: SetupsService, guards: Guards): Router {
  const router = Router();
  router.get('/', guards.requireSignIn, async (_request, response) => {
    response.json(await setups.list());
  });
  router.get('/:id', guards.requireSignIn, async (request, response) => {
    response.json(await setups.get(idParameter(request, 'setup')));
  });
  router.post('/', guards.requireRole('admin'), validateBody(saveSchema), async (request, response) => {
    response.status(201).json(await setups.create(request.body as SaveSetupRequest, request.user!.id));
  });
  router.put('/:id', guards.requireRole('admin'), validateBody(saveSchema), async (request, response) => {
    response.json(await setups.update(idParameter(request, 'setup'), request.body as SaveSetupRequest, request.user!.id));
  });
  return router;
}
