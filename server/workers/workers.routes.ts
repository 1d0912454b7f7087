import { Router } from 'express';
import type { Guards } from '../auth/passport';
import type { WorkersService } from './workers.service';

/** `/api/workers`: the analysis workers as the admins see them (who takes jobs, who keeps dying). */
export function workersRoutes(workers: WorkersService, guards: Guards): Router {
  const router = Router();
  router.get('/', guards.requireRole('admin'), async (_request, response) => {
    response.json(await workers.overview());
  });
  return router;
}
