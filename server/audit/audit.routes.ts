import { Router } from 'express';
import { stringify } from 'csv-stringify/sync';
import { auditFilterSchema, auditQuerySchema } from '@shared/api';
import type { Guards } from '../auth/passport';
import type { Models } from '../database/models';
import { validQuery } from '../http/validate-body';
import type { AuditTrail } from './audit-trail';
import { createAuditQueries } from './audit-queries';
import { checkTrailChain } from './trail-check';

/** `/api/audit`: the system-wide trail for auditors and admins, filtered, paged, exported as CSV and checked against its hash chain. */
export function auditRoutes(deps: { models: Models; audit: AuditTrail; guards: Guards }): Router {
  const { models, audit, guards } = deps;
  const queries = createAuditQueries(models);
  const router = Router();
  const readers = guards.requireRole('auditor', 'admin');

  router.get('/', readers, async (request, response) => {
    response.json(await queries.page(validQuery(auditQuerySchema, request)));
  });

  router.get('/actors', readers, async (_request, response) => {
    response.json(await queries.actors());
  });

  router.get('/trail-check', readers, async (_request, response) => {
    response.json(await checkTrailChain(models.AuditEvent.sequelize!));
  });

  router.get('/export.csv', readers, async (request, response) => {
    const filter = validQuery(auditFilterSchema, request);
    const events = await queries.all(filter);
    await audit.record({ actorId: request.user!.id, action: 'audit.exported', targetType: 'audit', targetId: 'trail', details: { filter, rows: events.length } });
    const rows = events.map((event) => [event.id, event.createdAt, event.actor ?? 'system', event.action, event.targetType, event.targetId, JSON.stringify(event.details)]);
    response.attachment('bellkeep-audit-trail.csv').type('text/csv');
    response.send(stringify(rows, { header: true, columns: ['id', 'time', 'actor', 'action', 'target_type', 'target_id', 'details'] }));
  });

  return router;
}
