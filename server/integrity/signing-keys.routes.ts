import { Router } from 'express';
import type { SigningKeysService } from './signing-keys.service';

/**
 * `GET /api/signing-keys`: every public key results were signed with, newest first. Public on
 * purpose, like any published public key: partner labs check exported reports against it.
 */
export function signingKeysRoutes(signingKeys: SigningKeysService): Router {
  const router = Router();
  router.get('/', async (_request, response) => {
    response.json(await signingKeys.list());
  });
  return router;
}
