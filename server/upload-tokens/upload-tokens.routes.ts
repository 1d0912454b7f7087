import { Router } from 'express';
import { createUploadTokenRequestSchema } from '@shared/api';
import type { Guards } from '../auth/passport';
import { idParameter } from '../http/id-parameter';
import { validateBody } from '../http/validate-body';
import type { UploadTokensService } from './upload-tokens.service';

/** `/api/setups/:id/upload-tokens`: an admin or the setup's shift lead lists, makes and revokes them. */
export function uploadTokensRoutes(deps: { tokens: UploadTokensService; guards: Guards }): Router {
  const { tokens, guards } = deps;
  const router = Router({ mergeParams: true });
  const keepers = guards.requireRole('admin', 'shift-lead');

  router.get('/', keepers, async (request, response) => {
    response.json(await tokens.list(idParameter(request, 'setup'), request.user!));
  });

  router.post('/', keepers, validateBody(createUploadTokenRequestSchema), async (request, response) => {
    response.status(201).json(await tokens.create(idParameter(request, 'setup'), request.body, request.user!));
  });

  router.post('/:tokenId/revoke', keepers, async (request, response) => {
    response.json(await tokens.revoke(idParameter(request, 'setup'), idParameter(request, 'upload token', 'tokenId'), request.user!));
  });

  return router;
}
