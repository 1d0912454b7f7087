import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { RUN_SEARCH_MIN_PREFIX, RUN_SORT_KEYS, RUN_STATES, VERDICTS } from '../../shared/api';
import type { Guards } from '../auth/passport';
import type { Config } from '../config/config';
import type { Models } from '../database/models';
import { idParameter } from '../http/id-parameter';
import { validateBody, validationError } from '../http/validate-body';
import { toAuditEventDtos } from '../audit/audit-event-dto';
import type { LogStore } from '../storage/log-store';
import type { RunsService } from './runs.service';
import { discardUpload, logUpload, uploadedLog } from './upload-middleware';
import { isoDate, positiveId, uploadFieldsSchema } from './upload-fields';
import { uploadKeys } from './upload-keys';

const hexPrefix = z
  .string()
  .regex(new RegExp(`^[0-9a-fA-F]{${RUN_SEARCH_MIN_PREFIX},64}$`), `must be ${RUN_SEARCH_MIN_PREFIX} to 64 hexadecimal digits`)
  .transform((hex) => hex.toLowerCase());

const listQuerySchema = z.strictObject({
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  sort: z.enum(RUN_SORT_KEYS).default('createdAt'),
  direction: z.enum(['asc', 'desc']).default('desc'),
  setupId: positiveId('a setup').optional(),
  state: z.enum(RUN_STATES).optional(),
  verdict: z.enum(VERDICTS).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  uploadedBy: positiveId('a user').optional(),
  profileVersionId: positiveId('a profile version').optional(),
  sha256: hexPrefix.optional(),
  fingerprint: hexPrefix.optional(),
  finished: z.enum(['true', 'false'], { error: 'must be true or false' }).transform((flag) => flag === 'true').optional(),
});

const signOffSchema = z.strictObject({ comment: z.string().trim().min(1, 'is required: say what you decided').max(4000) });

/** `/api/runs`: experimentalists and upload tokens upload; everyone signed in reads; shift leads sign off. */
export function runsRoutes(deps: { config: Config; runs: RunsService; logStore: LogStore; models: Models; guards: Guards; uploader: RequestHandler }): Router {
  const { config, runs, logStore, models, guards, uploader } = deps;
  const router = Router();

  const idempotency = uploadKeys(models.Run.sequelize!, runs);
  router.post('/', uploader, idempotency.middleware, logUpload(logStore, config.uploadLimitBytes), async (request, response) => {
    const fields = uploadFieldsSchema.safeParse(request.body ?? {});
    if (!fields.success) {
      await Promise.all([discardUpload(request), idempotency.release(response)]);
      throw validationError(fields.error);
    }
    const file = uploadedLog(request);
    try {
      const run = await runs.create(
        { ...fields.data, originalName: file.originalname, log: file.received },
        request.uploader!,
      );
      await idempotency.recordRun(response, run.id);
      response.status(201).json(run);
    } catch (error) {
      await idempotency.release(response);
      throw error;
    } finally {
      await discardUpload(request);
    }
  });

  router.get('/', guards.requireSignIn, async (request, response) => {
    const query = listQuerySchema.safeParse(request.query);
    if (!query.success) throw validationError(query.error);
    response.json(await runs.list(query.data));
  });

  router.get('/:id', guards.requireSignIn, async (request, response) => {
    response.json(await runs.get(idParameter(request, 'run')));
  });

  router.get('/:id/blocks', guards.requireSignIn, async (request, response) => {
    const run = await runs.get(idParameter(request, 'run'));
    response.json((run.result?.['blocks'] as unknown[] | undefined) ?? []);
  });

  router.get('/:id/trail', guards.requireSignIn, async (request, response) => {
    const id = idParameter(request, 'run');
    await runs.get(id);
    const events = await models.AuditEvent.findAll({ where: { targetType: 'run', targetId: String(id) }, order: [['id', 'ASC']] });
    response.json(await toAuditEventDtos(events, models));
  });

  router.post('/:id/sign-off', guards.requireRole('shift-lead'), validateBody(signOffSchema), async (request, response) => {
    const signOff = await runs.signOff(idParameter(request, 'run'), (request.body as z.infer<typeof signOffSchema>).comment, request.user!);
    response.status(201).json(signOff);
  });

  return router;
}
