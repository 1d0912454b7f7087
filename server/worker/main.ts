import { loadConfig } from '../config/config';
import { configureLog } from '../system/log';
import { openDatabase } from '../database/sequelize';
import { createMailer } from '../mail/mailer';
import { startAnalysisQueue } from '../queue/analysis-queue';
import { createServices } from '../services';
import { startWorker } from './worker';
import { TAKING_JOBS } from './worker-process';
import { endOnUnhandledFaults } from '../system/fault-lines';

/**
 * `npm run worker`: one analysis worker alone, for a machine that only analyses. It needs the
 * database (BELLKEEP_DATABASE_URL), the archive (BELLKEEP_STORAGE and its settings: the bucket,
 * or a data folder shared with the API), an SMTP server (BELLKEEP_SMTP_URL) and a work folder
 * of its own (BELLKEEP_WORK_DIR); run as many as the lab needs, on as many machines.
 */
async function main(): Promise<void> {
  endOnUnhandledFaults(`Worker ${process.pid}`);
  const config = loadConfig();
  configureLog(config.log);
  if (!config.databaseUrl) throw new Error('Set BELLKEEP_DATABASE_URL: a worker shares the database of the API.');
  if (!config.smtpUrl) throw new Error('Set BELLKEEP_SMTP_URL: a worker mails the verdicts.');
  const database = openDatabase(config.databaseUrl);
  const queue = await startAnalysisQueue(config.databaseUrl, database.sequelize, config.queue);
  const mailer = createMailer(config.smtpUrl, config.mailFrom);
  const worker = await startWorker(config, database, queue, createServices(config, database, queue), mailer);
  process.stdout.write(`Worker ${process.pid} ${TAKING_JOBS}.\n`);

  // Once, however often the signal comes (a process group's Ctrl-C and its relays): a repeat must
  // not fall back to Node's default and leave the job in hand unreturned.
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    await worker.stop();
    await queue.stop();
    mailer.close();
    await database.close();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop());
  process.on('SIGTERM', () => void stop());
  // Started by `npm start`: a worker whose starter died without stopping it (SIGKILL) stops too.
  const starter = Number(process.env['BELLKEEP_WORKER_STARTER_PID'] ?? 0);
  if (starter > 0) setInterval(() => void (isAlive(starter) || stop()), 1000).unref();
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`The worker could not start: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});
