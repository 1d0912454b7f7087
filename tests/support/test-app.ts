import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import type { LoginResponse } from '../../shared/api';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config/config';
import { seedDemo } from '../../server/database/migrate';
import { startMailCatcher, type MailCatcher } from '../../server/mail/mail-catcher';
import { createMailer, type Mailer } from '../../server/mail/mailer';
import { createWelcomeMail, type WelcomeMail } from '../../server/mail/welcome-mail';
import { freePort } from './free-port';
import { createTestDatabase, type TestDatabase } from './test-database';

export interface TestApp {
  app: Express;
  config: Config;
  database: TestDatabase;
  mailCatcher: MailCatcher;
  welcomeMail: WelcomeMail;
  /** Signs in through the API and returns the bearer token. */
  signIn(email: string, password: string): Promise<string>;
  close(): Promise<void>;
}

/**
 * The real app on a database of its own (with the demo lab seeded), a real mail catcher on free
 * ports, and cheap bcrypt. `environment` overrides configuration variables.
 */
export async function createTestApp(environment: Record<string, string> = {}): Promise<TestApp> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-test-data-'));
  const config = loadConfig({ BELLKEEP_DATA_DIR: dataDir, BELLKEEP_BCRYPT_ROUNDS: '4', BELLKEEP_LOGIN_LIMIT: '1000', ...environment });
  const database = await createTestDatabase();
  await seedDemo(database.sequelize);
  const mailCatcher = await startMailCatcher(await freePort(), await freePort(), path.join(dataDir, 'mail'));
  const mailer: Mailer = createMailer(mailCatcher.smtpUrl, config.mailFrom);
  const welcomeMail = createWelcomeMail(mailer, config.publicUrl);
  const app = createApp({ config, database, jwtSecret: 'test-secret-that-is-long-enough-for-hs256', welcomeMail });
  return {
    app,
    config,
    database,
    mailCatcher,
    welcomeMail,
    async signIn(email, password) {
      const response = await request(app).post('/api/auth/login').send({ email, password }).expect(200);
      return (response.body as LoginResponse).token;
    },
    async close() {
      await welcomeMail.settled();
      mailer.close();
      await mailCatcher.stop();
      await database.drop();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
