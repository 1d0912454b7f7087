import fs from 'node:fs';
import path from 'node:path';
import { startApiServer } from './api-server';
import { loadConfig } from './config/config';
import { configureLog } from './system/log';

/**
 * `npm run api`: the API alone, for a machine that only serves. It starts no PostgreSQL, mail
 * catcher, worker or Angular build of its own: it needs BELLKEEP_DATABASE_URL, BELLKEEP_SMTP_URL
 * and the storage settings. It brings the database up to date (migrations, its signing key, the
 * demo lab and its history when BELLKEEP_DEMO=true), serves the built app when dist/ holds one,
 * and stops on SIGINT or SIGTERM.
 */
async function main(): Promise<void> {
  // A production API seeds no demo lab unless BELLKEEP_DEMO=true asks (npm start's default is the demo).
  const config = loadConfig({ BELLKEEP_DEMO: 'false', ...process.env });
  configureLog(config.log);
  if (!config.databaseUrl) throw new Error('Set BELLKEEP_DATABASE_URL: the API alone runs no database of its own.');
  if (!config.smtpUrl) throw new Error('Set BELLKEEP_SMTP_URL: the API mails welcome letters and runs no mail catcher of its own.');
  const api = await startApiServer(config, { databaseUrl: config.databaseUrl, smtpUrl: config.smtpUrl }, { history: true });
  const { migrations, seeders } = api.report;
  const app = fs.existsSync(path.join(config.appDir, 'index.html')) ? `serving the app from ${config.appDir}` : 'no built app to serve';
  process.stdout.write(`Bellkeep API ${process.pid} on http://${config.host}:${config.port} (${migrations.length} migration(s), ${seeders.length} seeder(s); ${app}).\n`);

  const stop = async () => {
    await api.stop();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop());
  process.once('SIGTERM', () => void stop());
}

main().catch((error: unknown) => {
  process.stderr.write(`The API could not start: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});
