import fs from 'node:fs';
import path from 'node:path';
import { startApiServer } from './api-server';
import { loadConfig } from './config/config';
import { startPostgresCluster } from './database/postgres-cluster';
import { startMailCatcher } from './mail/mail-catcher';
import { startStorageBackend } from './storage/storage-backend';
import { buildAppIfStale, startDevServer } from './system/angular-build';
import { spawnWorkerProcess, stopWorkerProcess } from './worker/worker-process';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../seeders/data/demo-people';

/**
 * `npm start`: the project's own PostgreSQL and mail catcher (unless the environment names real
 * ones), the local fake S3 server when BELLKEEP_STORAGE=s3 names no endpoint, migrations and
 * demo data, the built app, and the API; stops what it started on Ctrl-C.
 * `--dev` serves the app with Angular's dev server and its proxy instead of the build.
 */
/** What to undo on the way out, in the order things were started. */
const stops: Array<() => void | Promise<void>> = [];

async function stopAll(): Promise<void> {
  for (const stop of stops.reverse()) await stop();
}

async function main(): Promise<void> {
  const devMode = process.argv.includes('--dev');
  const config = loadConfig();
  fs.mkdirSync(config.dataDir, { recursive: true });

  let databaseUrl = config.databaseUrl;
  if (!databaseUrl) {
    const cluster = await startPostgresCluster({ folder: path.join(config.dataDir, 'postgres'), port: config.postgresPort, database: 'bellkeep' });
    if (cluster.startedHere) stops.push(() => cluster.stop());
    databaseUrl = cluster.url;
    say(`PostgreSQL   127.0.0.1:${config.postgresPort} (${cluster.startedHere ? 'started' : 'already running'}; data in ${path.join(config.dataDir, 'postgres')})`);
  }

  let smtpUrl = config.smtpUrl;
  if (!smtpUrl) {
    const mailFolder = path.join(config.dataDir, 'mail');
    fs.mkdirSync(mailFolder, { recursive: true });
    const catcher = await startMailCatcher(config.mailCatcher.smtpPort, config.mailCatcher.webPort, mailFolder);
    stops.push(() => catcher.stop());
    smtpUrl = catcher.smtpUrl;
    say(`Mail catcher SMTP 127.0.0.1:${config.mailCatcher.smtpPort}, inbox ${catcher.inboxUrl}`);
  }

  const archive = await startStorageBackend(config);
  stops.push(() => archive.stop());
  say(`Archive      ${archive.description}`);
  const started = { ...config, storage: archive.storage };

  if (!devMode) await buildAppIfStale(config.appDir);
  const api = await startApiServer(started, { databaseUrl, smtpUrl }, { history: true });
  stops.push(() => api.stop());
  const { report } = api;
  say(`Database     ${report.migrations.length} migration(s) applied, ${report.seeders.length} seeder(s) run`);
  if (report.createdAdmin) say(`First admin  ${report.createdAdmin} (from BELLKEEP_ADMIN_EMAIL)`);
  const worker = spawnWorkerProcess({ BELLKEEP_DATABASE_URL: databaseUrl, BELLKEEP_SMTP_URL: smtpUrl, ...archive.workerEnvironment });
  stops.push(() => stopWorkerProcess(worker));

  let openUrl = config.publicUrl;
  if (devMode) {
    const devServer = startDevServer();
    stops.push(() => devServer.stop());
    openUrl = devServer.url;
  }
  say(`\nBellkeep is running: open ${openUrl}`);
  if (config.demo) {
    say(`Demo sign-ins (password ${DEMO_PASSWORD}):`);
    for (const person of DEMO_PEOPLE) say(`  ${person.email.padEnd(34)} ${person.roles.join(', ')}`);
  }
  say('Ctrl-C stops it.');

  const shutDown = async () => {
    say('\nStopping Bellkeep...');
    await stopAll();
    process.exit(0);
  };
  process.once('SIGINT', shutDown);
  process.once('SIGTERM', shutDown);
}

function say(line: string): void {
  process.stdout.write(`${line}\n`);
}

main().catch(async (error: unknown) => {
  process.stderr.write(`Bellkeep could not start: ${error instanceof Error ? error.message : String(error)}\n`);
  await stopAll();
  process.exit(1);
});
