import type { Job } from 'pg-boss';
import type { Config } from '../config/config';
import type { Database } from '../database/sequelize';
import type { Mailer } from '../mail/mailer';
import { ANALYSIS_QUEUE, REVERIFICATION_QUEUE, VERDICT_MAIL_QUEUE, type AnalysisQueue, type ReverificationJob, type RunJob } from '../queue/analysis-queue';
import type { Services } from '../services';
import { removeLeftoverCopies } from '../storage/working-copy';
import { log, requestContext } from '../system/log';
import { analyseRun } from './analyse-run';
import { reverifyRun } from './reverify-run';
import { sendVerdictMail } from './send-verdict-mail';

/**
 * Runs a job's work in the context of the request that made it (the jobs it makes carry the id
 * on), with a log line when it starts and when it ends. A job made by no request (the demo
 * history, a retry of an old job) is known by its job id.
 */
async function traced<T extends { requestId?: string }>(job: Job<T>, work: () => Promise<void>): Promise<void> {
  await requestContext.run({ requestId: job.data.requestId ?? `job-${job.id}` }, async () => {
    const started = performance.now();
    // The job's own fields (its run or re-verification); the request id comes from the context.
    const { requestId: _carried, ...subject } = job.data;
    const what: Record<string, unknown> = { queue: job.name, job: job.id, ...subject };
    log.info(what, 'job started');
    try {
      await work();
      log.info({ ...what, seconds: (performance.now() - started) / 1000 }, 'job done');
    } catch (error) {
      log.warn({ ...what, seconds: (performance.now() - started) / 1000, error: error instanceof Error ? error.message : String(error) }, 'job failed');
      throw error;
    }
  });
}

export interface RunningWorker {
  /** Cancels the analysis in hand (its job is handed out again) and stops taking jobs. */
  stop(): Promise<void>;
}

/**
 * A worker: takes analysis and re-verification jobs one at a time each (the engine uses both
 * cores) and verdict-mail jobs.
 * Needs only the database (queue and results) and the log store; any number may run on any
 * machine, each with a work folder of its own (BELLKEEP_WORK_DIR) for copies of the logs it reads.
 */
export async function startWorker(config: Config, database: Database, queue: AnalysisQueue, services: Services, mailer: Mailer): Promise<RunningWorker> {
  const stopping = new AbortController();
  const { sequelize, models } = database;
  // Results are signed with this process's key: it must be the one the API lists as in use.
  await services.signingKeys.register();
  await services.logStore.prepare();
  // Copies left by this worker's predecessor, if it was killed mid-analysis.
  await removeLeftoverCopies(config.workDir);
  const presence = await services.workers.announce();
  const analysisDeps = { sequelize, models, logStore: services.logStore, workFolder: config.workDir, queue, audit: services.audit, signingKey: services.signingKeys.current };
  const mailDeps = { sequelize, models, runs: services.runs, setups: services.setups, mailer, audit: services.audit, publicUrl: config.publicUrl };

  await queue.boss.work<RunJob>(ANALYSIS_QUEUE, { batchSize: 1, pollingIntervalSeconds: config.queue.pollingIntervalSeconds }, async ([job]) => {
    await traced(job, () => analyseRun(job.data.runId, analysisDeps, stopping.signal));
  });
  await queue.boss.work<ReverificationJob>(REVERIFICATION_QUEUE, { batchSize: 1, pollingIntervalSeconds: config.queue.pollingIntervalSeconds }, async ([job]) => {
    await traced(job, () => reverifyRun(job.data.reverificationId, analysisDeps, stopping.signal));
  });
  await queue.boss.work<RunJob>(VERDICT_MAIL_QUEUE, { batchSize: 1, pollingIntervalSeconds: config.queue.pollingIntervalSeconds }, async ([job]) => {
    await traced(job, () => sendVerdictMail(job.data.runId, mailDeps));
  });

  return {
    async stop() {
      stopping.abort();
      await queue.boss.offWork(ANALYSIS_QUEUE);
      await queue.boss.offWork(REVERIFICATION_QUEUE);
      await queue.boss.offWork(VERDICT_MAIL_QUEUE);
      // With the database down the record stays open, and reads as silent: nothing to undo.
      await presence.stop().catch(() => undefined);
    },
  };
}
