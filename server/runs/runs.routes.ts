import { Router, type RequestHandler } from 'express';
import { realignRequestSchema, runListQuerySchema, stationLogQuerySchema, signOffRequestSchema, withdrawRequestSchema } from '@shared/api';
import type { Guards } from '../auth/passport';
import type { Config } from '../config/config';
import type { Models } from '../database/models';
import { idParameter } from '../http/id-parameter';
import { validateBody, validationError, validQuery } from '../http/validate-body';
import { toAuditEventDtos } from '../audit/audit-event-dto';
import type { AppMail } from '../mail/app-mail';
import type { SetupsService } from '../setups/setups.service';
import type { LogStore } from '../storage/log-store';
import type { RunsService } from './runs.service';
import { discardUpload, logUpload, uploadedLog } from './upload-middleware';
import { uploadFieldsSchema } from './upload-fields';
import { uploadKeys } from './upload-keys';

/**
 * `/api/runs`: experimentalists and upload tokens upload; everyone signed in reads; shift leads sign
 * off or re-run a pair of station logs at a stated offset; an uploader or admin withdraws a mistaken
 * upload (the service checks who). An upload with `station` is one station's own log.
 */
export function runsRoutes(deps: {
  config: Config;
  runs: RunsService;
  setups: SetupsService;
  appMail: AppMail;
  logStore: LogStore;
  models: Models;
  guards: Guards;
  uploader: RequestHandler;
}): Router {
  const { config, runs, setups, appMail, logStore, models, guards, uploader } = deps;
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
      const { station, ...rest } = fields.data;
      const upload = { ...rest, originalName: file.originalname, log: file.received };
      if (station === undefined) {
        const run = await runs.create(upload, request.uploader!);
        await idempotency.record(response, { runId: run.id });
        return void response.status(201).json(run);
      }
      // A station's log: the run when it completes the night's pair (201), else the log waiting for the other station's (202).
      const arrival = await runs.receiveStationLog({ ...upload, station }, request.uploader!);
      if (arrival.run === null) {
        await idempotency.record(response, { stationLogId: arrival.stationLog.id });
        return void response.status(202).json(arrival.stationLog);
      }
      await idempotency.record(response, { runId: arrival.run.id });
      response.status(201).json(arrival.run);
    } catch (error) {
      await idempotency.release(response);
      throw error;
    } finally {
      await discardUpload(request);
    }
  });

  router.get('/station-logs', guards.requireSignIn, async (request, response) => {
    response.json(await runs.stationLogs(validQuery(stationLogQuerySchema, request)));
  });

  router.get('/', guards.requireSignIn, async (request, response) => {
    response.json(await runs.list(validQuery(runListQuerySchema, request)));
  });

  router.get('/:id', guards.requireSignIn, async (request, response) => {
    response.json(await runs.get(idParameter(request, 'run')));
  });

  router.get('/:id/blocks', guards.requireSignIn, async (request, response) => {
    const run = await runs.get(idParameter(request, 'run'));
    response.json(run.result?.blocks ?? []);
  });

  router.get('/:id/trail', guards.requireSignIn, async (request, response) => {
    const id = idParameter(request, 'run');
    await runs.get(id);
    const events = await models.AuditEvent.findAll({ where: { targetType: 'run', targetId: String(id) }, order: [['id', 'ASC']] });
    response.json(await toAuditEventDtos(events, models));
  });

  router.post('/:id/sign-off', guards.requireRole('shift-lead'), validateBody(signOffRequestSchema), async (request, response) => {
    const signOff = await runs.signOff(idParameter(request, 'run'), request.body, request.user!);
    response.status(201).json(signOff);
  });

  router.post('/:id/realign', guards.requireRole('shift-lead'), validateBody(realignRequestSchema), async (request, response) => {
    response.status(201).json(await runs.realign(idParameter(request, 'run'), request.body, request.user!));
  });

  router.post('/:id/withdraw', guards.requireSignIn, validateBody(withdrawRequestSchema), async (request, response) => {
    const id = idParameter(request, 'run');
    const withdrawal = await runs.withdraw(id, request.body, request.user!);
    const run = await runs.get(id);
    appMail.withdrawn(run, withdrawal, await setups.verdictRecipients(run.setupId));
    response.status(201).json(withdrawal);
  });

  return router;
}
