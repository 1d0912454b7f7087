import { Router } from 'express';
import type { ReadinessDto } from '@shared/api';
import type { Database } from '../database/sequelize';
import { ANALYSIS_QUEUE, type AnalysisQueue } from '../queue/analysis-queue';
import type { LogStore } from '../storage/log-store';
import { oneLine } from '../system/fault-lines';
import type { Lifecycle } from './drain';

/** A part that does not answer within this long is taken for down. */
const PART_TIMEOUT_MS = 2_000;
/** No log has this name: asking for its size only proves the archive answers. */
const NO_SUCH_LOG = '0'.repeat(64);

async function withinTimeout(work: Promise<unknown>): Promise<void> {
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<never>((_resolve, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${PART_TIMEOUT_MS / 1000} s`)), PART_TIMEOUT_MS);
  });
  try {
    await Promise.race([work, late]);
  } finally {
    clearTimeout(timer);
  }
}

/**
 * `/api/health`: the process lives (for a supervisor that restarts it). `/api/ready`: the parts a
 * request needs answer (the database, the job queue, the archive), 200 or 503 naming the part
 * that does not (for a load balancer that sends no traffic meanwhile), and 503 while the API stops. Both public and say
 * nothing about the data; a part's error is worded in one line without addresses of its own.
 */
export function healthRoutes(deps: { database: Database; queue: AnalysisQueue; logStore: LogStore; lifecycle: Lifecycle }): Router {
  const router = Router();
  router.get('/health', (_request, response) => {
    response.json({ status: 'ok' });
  });
  router.get('/ready', async (_request, response) => {
    const parts = {
      database: () => deps.database.sequelize.query('SELECT 1'),
      queue: () => deps.queue.boss.getQueueSize(ANALYSIS_QUEUE),
      archive: () => deps.logStore.stat(NO_SUCH_LOG),
    };
    const checks = await Promise.all(
      Object.entries(parts).map(async ([part, probe]) => {
        try {
          await withinTimeout(probe());
          return { part, ready: true, problem: null };
        } catch (error) {
          return { part, ready: false, problem: oneLine(error) };
        }
      }),
    );
    if (deps.lifecycle.draining) checks.push({ part: 'process', ready: false, problem: 'stopping: finishing the requests in flight' });
    const ready = checks.every((check) => check.ready);
    const body: ReadinessDto = { status: ready ? 'ready' : 'not-ready', checks };
    response.status(ready ? 200 : 503).json(body);
  });
  return router;
}
