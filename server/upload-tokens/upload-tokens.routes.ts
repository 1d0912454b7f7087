import { Router } from 'express';
import { z } from 'zod';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody } from '../http/validate-body';
import type { UploadTokensService } from './upload-tokens.service';

const createSchema = z.strictObject({
  name: z.string().trim().min(1, 'is required: name the computer that will use it').max(120),
  validDays: z.number({ error: 'must be a number of days' }).int().min(1, 'must be at least 1 day').max(366, 'must be at most 366 days'),
});

/** `/api/setups/:id/upload-tokens`: an admin or the setup's shift lead lists, makes and revokes them. */
export function uploadTokensRoutes(deps: { tokens: UploadTokensService; guards: Guards }): Router {
  const { tokens, guards } = deps;
  const router = Router({ mergeParams: true });
  const keepers = guards.requireRole('admin', 'shift-lead');

  router.get('/', keepers, async (request, response) => {
    response.json(await tokens.list(idParameter(request, 'setup'), request.user!));
  });

  router.post('/', keepers, validateBody(createSchema), async (request, response) => {
    response.status(201).json(await tokens.create(idParameter(request, 'setup'), request.body as z.infer<typeof createSchema>, request.user!));
  });

  router.post('/:tokenId/revoke', keepers, async (request, response) => {
    response.json(await tokens.revoke(idParameter(request, 'setup'), idParameter(request, 'upload token', 'tokenId'), request.user!));
  });

  return router;
}
