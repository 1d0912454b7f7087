import crypto from 'node:crypto';
import { Router, type RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { Guards } from '../auth/passport';
import { labMetrics } from './lab-metrics';

/** Whether the request carries the configured scrape token as its bearer token (compared in constant time). */
function carriesScrapeToken(authorization: string | undefined, scrapeToken: string | undefined): boolean {
  if (!scrapeToken || !authorization?.startsWith('Bearer ')) return false;
  const given = crypto.createHash('sha256').update(authorization.slice('Bearer '.length)).digest();
  return crypto.timingSafeEqual(given, crypto.createHash('sha256').update(scrapeToken).digest());
}

/** `GET /metrics`: Prometheus text, for a scraper holding BELLKEEP_METRICS_TOKEN or a signed-in admin. */
export function metricsRoutes(deps: { sequelize: Sequelize; guards: Guards; scrapeToken: string | undefined }): Router {
  const registry = labMetrics(deps.sequelize);
  const adminOnly = deps.guards.requireRole('admin');
  const scraperOrAdmin: RequestHandler = (request, response, next) =>
    carriesScrapeToken(request.headers.authorization, deps.scrapeToken) ? next() : adminOnly(request, response, next);
  const router = Router();
  router.get('/metrics', scraperOrAdmin, async (_request, response) => {
    response.type(registry.contentType).send(await registry.metrics());
  });
  return router;
}
