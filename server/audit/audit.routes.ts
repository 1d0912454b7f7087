import { Router } from 'express';
import { stringify } from 'csv-stringify/sync';
import { z } from 'zod';
import { AUDIT_TARGET_TYPES } from '../../shared/api';
import type { Guards } from '../auth/passport';
import type { Models } from '../database/models';
import { validationError } from '../http/validate-body';
import type { AuditTrail } from './audit-trail';
import { createAuditQueries, type AuditFilter } from './audit-queries';
import { checkTrailChain } from './trail-check';

const isoDate = z.iso.date({ error: 'must be a date as YYYY-MM-DD' });

const filterShape = {
  actorId: z.coerce.number({ error: 'must be a user id' }).int().positive({ error: 'must be a user id' }).optional(),
  action: z.string().regex(/^[a-z-]+(\.[a-z-]*)?$/, 'must be an action such as run.exported, or a family such as run.').optional(),
  targetType: z.enum(AUDIT_TARGET_TYPES, { error: `must be one of ${AUDIT_TARGET_TYPES.join(', ')}` }).optional(),
  targetId: z.string().max(64, 'must be at most 64 characters').optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
};
const pageSchema = z.strictObject({
  ...filterShape,
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
});
const exportSchema = z.strictObject(filterShape);

/** `/api/audit`: the system-wide trail for auditors and admins, filtered, paged, exported as CSV and checked against its hash chain. */
export function auditRoutes(deps: { models: Models; audit: AuditTrail; guards: Guards }): Router {
  const { models, audit, guards } = deps;
  const queries = createAuditQueries(models);
  const router = Router();
  const readers = guards.requireRole('auditor', 'admin');

  router.get('/', readers, async (request, response) => {
    const query = pageSchema.safeParse(request.query);
    if (!query.success) throw validationError(query.error);
    response.json(await queries.page(query.data));
  });

  router.get('/actors', readers, async (_request, response) => {
    response.json(await queries.actors());
  });

  router.get('/trail-check', readers, async (_request, response) => {
    response.json(await checkTrailChain(models.AuditEvent.sequelize!));
  });

  router.get('/export.csv', readers, async (request, response) => {
    const query = exportSchema.safeParse(request.query);
    if (!query.success) throw validationError(query.error);
    const filter: AuditFilter = query.data;
    const events = await queries.all(filter);
    await audit.record({ actorId: request.user!.id, action: 'audit.exported', targetType: 'audit', targetId: 'trail', details: { filter, rows: events.length } });
    const rows = events.map((event) => [event.id, event.createdAt, event.actor ?? 'system', event.action, event.targetType, event.targetId, JSON.stringify(event.details)]);
    response.attachment('bellkeep-audit-trail.csv').type('text/csv');
    response.send(stringify(rows, { header: true, columns: ['id', 'time', 'actor', 'action', 'target_type', 'target_id', 'details'] }));
  });

  return router;
}
