import PgBoss from 'pg-boss';
import type { Sequelize, Transaction } from 'sequelize';
import { faultLines } from '../system/fault-lines';
import { currentRequestId } from '../system/log';

/** Queue of analyses: one job per run, payload `{ runId, requestId }`. */
export const ANALYSIS_QUEUE = 'run-analysis';
/** Queue of verdict mails: one job per finished run, payload `{ runId, requestId }`. */
export const VERDICT_MAIL_QUEUE = 'verdict-mail';
/** Queue of re-verifications: one job per request, payload `{ reverificationId, requestId }`. */
export const REVERIFICATION_QUEUE = 'run-reverification';

/** Every job carries the id of the request it serves, so its logs can be followed from the request. */
interface TracedJob {
  requestId?: string;
}

export interface RunJob extends TracedJob {
  runId: number;
}

export interface ReverificationJob extends TracedJob {
  reverificationId: number;
}

export interface QueueOptions {
  /** How long an analysis may run before the queue takes it for dead and hands it out again. */
  analysisExpireSeconds: number;
  /** How often the queue's maintenance looks for expired jobs. */
  maintenanceIntervalSeconds: number;
  /** Seconds between the retries of a failed mail delivery. */
  mailRetryDelaySeconds: number;
}

export interface AnalysisQueue {
  readonly boss: PgBoss;
  /** Enqueues within the caller's transaction: the job exists exactly when the change commits. */
  enqueueAnalysis(runId: number, transaction: Transaction): Promise<void>;
  enqueueVerdictMail(runId: number, transaction: Transaction): Promise<void>;
  enqueueReverification(reverificationId: number, transaction: Transaction): Promise<void>;
  stop(): Promise<void>;
}

/**
 * The durable job queue (pg-boss 10 in PostgreSQL): at-least-once delivery, shared by every API
 * and worker process on the same database, on any machine.
 */
export async function startAnalysisQueue(databaseUrl: string, sequelize: Sequelize, options: QueueOptions): Promise<AnalysisQueue> {
  const boss = new PgBoss({
    connectionString: databaseUrl,
    max: 4,
    application_name: 'bellkeep-queue',
    maintenanceIntervalSeconds: options.maintenanceIntervalSeconds,
    monitorStateIntervalSeconds: Math.max(options.maintenanceIntervalSeconds, 1),
  });
  boss.on('error', faultLines('Job queue'));
  await boss.start();
  const queues = [
    { name: ANALYSIS_QUEUE, retryLimit: 5, retryDelay: 2, retryBackoff: true, expireInSeconds: options.analysisExpireSeconds },
    { name: REVERIFICATION_QUEUE, retryLimit: 5, retryDelay: 2, retryBackoff: true, expireInSeconds: options.analysisExpireSeconds },
    { name: VERDICT_MAIL_QUEUE, retryLimit: 50, retryDelay: options.mailRetryDelaySeconds, retryBackoff: false, expireInSeconds: 120 },
  ];
  for (const queue of queues) {
    // Created by the first process ever; later starts apply the configuration as it is now.
    if (await boss.getQueue(queue.name)) await boss.updateQueue(queue.name, queue);
    else await boss.createQueue(queue.name, queue);
  }

  // pg-boss writes its job row through the caller's transaction. It leaves options it was not
  // given undefined, which Sequelize refuses as a bind value; SQL wants null there.
  const inTransaction = (transaction: Transaction) => ({
    executeSql: async (text: string, values: unknown[]) => {
      const [rows] = await sequelize.query(text, { bind: values.map((value) => value ?? null), transaction });
      return { rows: rows };
    },
  });

  return {
    boss,
    async enqueueAnalysis(runId, transaction) {
      await boss.send(ANALYSIS_QUEUE, { runId, requestId: currentRequestId() } satisfies RunJob, { db: inTransaction(transaction) });
    },
    async enqueueVerdictMail(runId, transaction) {
      await boss.send(VERDICT_MAIL_QUEUE, { runId, requestId: currentRequestId() } satisfies RunJob, { db: inTransaction(transaction) });
    },
    async enqueueReverification(reverificationId, transaction) {
      await boss.send(REVERIFICATION_QUEUE, { reverificationId, requestId: currentRequestId() } satisfies ReverificationJob, { db: inTransaction(transaction) });
    },
    stop: () => boss.stop({ graceful: true, wait: true, timeout: 10_000 }),
  };
}
