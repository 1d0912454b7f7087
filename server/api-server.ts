import { createApp } from './app';
import { resolveJwtSecret } from './auth/jwt-secret';
import type { Config } from './config/config';
import { bootstrapDatabase, seedHistory, type BootstrapReport } from './database/bootstrap';
import { openDatabase } from './database/sequelize';
import { createMailer } from './mail/mailer';
import { createAppMail } from './mail/app-mail';
import { startAnalysisQueue } from './queue/analysis-queue';
import { createServices } from './services';
import { drain, type Lifecycle } from './http/drain';
import { faultLines } from './system/fault-lines';

/** Where the API finds the database and the mail server, both already running. */
export interface ApiConnections {
  databaseUrl: string;
  smtpUrl: string;
}

export interface RunningApi {
  /** What start-up did to the database. */
  report: BootstrapReport;
  /** Seeds the demo history now (when the demo is on and it was not seeded yet), while the API serves. */
  seedHistory(onProgress: (done: number, total: number) => void): Promise<string[]>;
  /** Records that the worker `pid` on this machine ended unasked (the admins see it); never throws. */
  recordWorkerEnd: (pid: number, how: string) => void;
  /** Stops listening and drains the requests in flight (BELLKEEP_DRAIN_SECONDS), then closes the queue, the mailer and the database. */
  stop(): Promise<void>;
}

/**
 * The API over a running database and mail server: the database brought up to date
 * (`bootstrapDatabase`, with the demo history when `history` and BELLKEEP_DEMO ask for it), the
 * job queue, the services and the app, listening on the configured host and port. `npm start` and
 * `npm run api` both start it here; a failure on the way closes what was opened.
 */
export async function startApiServer(config: Config, connections: ApiConnections, options: { history: boolean }): Promise<RunningApi> {
  const undo: Array<() => void | Promise<void>> = [];
  const stop = async () => {
    for (const step of undo.splice(0).reverse()) await step();
  };
  try {
    const database = openDatabase(connections.databaseUrl);
    undo.push(() => database.close());
    const report = await bootstrapDatabase(database, config, options);
    const mailer = createMailer(connections.smtpUrl, config.mailFrom);
    undo.push(() => mailer.close());
    const jwtSecret = resolveJwtSecret(config.jwtSecret, config.dataDir);
    const queue = await startAnalysisQueue(connections.databaseUrl, database.sequelize, config.queue);
    undo.push(() => queue.stop());
    const services = createServices(config, database, queue);
    const lifecycle: Lifecycle = { draining: false };
    const app = createApp({ config, database, services, jwtSecret, appMail: createAppMail(mailer, config.publicUrl), queue, lifecycle });
    const server = app.listen(config.port, config.host);
    await new Promise<void>((resolve, reject) => server.once('listening', resolve).once('error', reject));
    undo.push(() => drain(server, lifecycle, config.drainSeconds));
    const recordingFailed = faultLines('Worker records');
    const recordWorkerEnd = (pid: number, how: string) => void services.workers.recordUnaskedEnd(pid, how).catch(recordingFailed);
    return { report, seedHistory: (onProgress) => seedHistory(database, config, onProgress), recordWorkerEnd, stop };
  } catch (error) {
    await stop();
    throw error;
  }
}
