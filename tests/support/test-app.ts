import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import type { LoginResponse } from '@shared/api';
import { createApp } from '@server/app';
import { loadConfig, type Config } from '@server/config/config';
import { seedDemo } from '@server/database/migrate';
import { startMailCatcher, type MailCatcher } from '@local-stack/mail-catcher';
import { createMailer, type Mailer } from '@server/mail/mailer';
import { createAppMail, type AppMail } from '@server/mail/app-mail';
import { startAnalysisQueue, type AnalysisQueue } from '@server/queue/analysis-queue';
import { createServices, type Services } from '@server/services';
import { startStorageBackend, type StorageBackend } from '@local-stack/storage-backend';
import { startWorker, type RunningWorker } from '@server/worker/worker';
import { freePort } from './free-port';

/** The token secret of test apps (tests forge tokens with it). */
export const TEST_JWT_SECRET = 'test-secret-that-is-long-enough-for-hs256';
import { createTestDatabase, type TestDatabase } from './test-database';
import { contractRecordingApp, createContractChecker } from './api-contract';

export interface TestApp {
  app: Express;
  config: Config;
  database: TestDatabase;
  mailCatcher: MailCatcher;
  appMail: AppMail;
  queue: AnalysisQueue;
  services: Services;
  /** The archive's backend: its `workerEnvironment` lets a worker process reach the same archive. */
  storage: StorageBackend;
  mailer: Mailer;
  /** Starts the mail catcher again on the same ports, after a test stopped it. */
  restartMailCatcher(): Promise<void>;
  /** Starts an analysis worker in this process (tests that need verdicts call it). */
  startWorker(): Promise<RunningWorker>;
  /** Signs in through the API and returns the bearer token. */
  signIn(email: string, password: string): Promise<string>;
  close(): Promise<void>;
}

/**
 * The real app on a database of its own (with the demo lab seeded), a real mail catcher on free
 * ports, and cheap bcrypt. `environment` overrides configuration variables: with
 * `BELLKEEP_STORAGE: 's3'` the archive is a bucket of the local fake S3 server, started on a free
 * port as `npm start` starts it.
 */
export async function createTestApp(environment: Record<string, string> = {}): Promise<TestApp> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-test-data-'));
  const database = await createTestDatabase();
  const loaded = loadConfig({
    BELLKEEP_DATA_DIR: dataDir,
    BELLKEEP_DATABASE_URL: database.url,
    BELLKEEP_BCRYPT_ROUNDS: '4',
    BELLKEEP_LOGIN_LIMIT: '1000',
    BELLKEEP_LOGIN_ACCOUNT_LIMIT: '1000',
    BELLKEEP_QUEUE_POLLING_SECONDS: '0.5',
    BELLKEEP_QUEUE_MAINTENANCE_SECONDS: '1',
    BELLKEEP_MAIL_RETRY_SECONDS: '3',
    BELLKEEP_S3_FAKE_PORT: String(await freePort()),
    ...environment,
  });
  const storage = await startStorageBackend(loaded);
  const config = { ...loaded, storage: storage.storage };
  await seedDemo(database.sequelize);
  const mailPorts = [await freePort(), await freePort()] as const;
  const mailFolder = path.join(dataDir, 'mail');
  let mailCatcher = await startMailCatcher(...mailPorts, mailFolder);
  const mailer: Mailer = createMailer(mailCatcher.smtpUrl, config.mailFrom);
  const appMail = createAppMail(mailer, config.publicUrl);
  const queue = await startAnalysisQueue(database.url, database.sequelize, config.queue);
  const services = createServices(config, database, queue);
  // As `npm start` does on bootstrap: the key results are signed with is listed before any run.
  await services.signingKeys.register();
  // Every answer the tests provoke is checked against the OpenAPI document; a misfit fails `close`.
  const { app, misfits } = contractRecordingApp(createApp({ config, database, services, jwtSecret: TEST_JWT_SECRET, appMail, queue }), createContractChecker());
  const workers: RunningWorker[] = [];
  return {
    app,
    config,
    database,
    get mailCatcher() {
      return mailCatcher;
    },
    appMail,
    queue,
    services,
    storage,
    mailer,
    async restartMailCatcher() {
      mailCatcher = await startMailCatcher(...mailPorts, mailFolder);
    },
    async startWorker() {
      const worker = await startWorker(config, database, queue, services, mailer);
      workers.push(worker);
      return worker;
    },
    async signIn(email, password) {
      const response = await request(app).post('/api/auth/login').send({ email, password }).expect(200);
      return (response.body as LoginResponse).token;
    },
    async close() {
      for (const worker of workers) await worker.stop();
      // pg-boss checks its stopping workers once a second from a timer of its own, which needs
      // node:timers/promises: once jest has unloaded this file's modules, that check throws into
      // whichever test file runs next in this jest worker. Let it see them stopped first.
      if (workers.length > 0) await new Promise((resolve) => setTimeout(resolve, 1_100));
      await queue.stop();
      await appMail.settled();
      mailer.close();
      await mailCatcher.stop();
      await storage.stop();
      await database.drop();
      fs.rmSync(dataDir, { recursive: true, force: true });
      if (misfits.length > 0) throw new Error(`Answers that do not fit the OpenAPI document (/api/openapi.json):\n${[...new Set(misfits)].join('\n')}`);
    },
  };
}
