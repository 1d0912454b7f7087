import { Router } from 'express';
import { ledgerQuerySchema } from '@shared/api';
import type { Guards } from '../auth/passport';
import { validQuery } from '../http/validate-body';
import type { LedgerService } from './ledger.service';

/** `GET /api/ledger` (the nights of every setup) and `GET /api/worklist` (what waits for the signed-in person). */
export function ledgerRoutes(ledger: LedgerService, guards: Guards): Router {
  const router = Router();
  router.get('/ledger', guards.requireSignIn, async (request, response) => {
    response.json(await ledger.ledger(validQuery(ledgerQuerySchema, request)));
  });
  router.get('/worklist', guards.requireSignIn, async (request, response) => {
    response.json(await ledger.worklist(request.user!));
  });
  return router;
}
