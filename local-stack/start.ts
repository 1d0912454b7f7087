import fs from 'node:fs';
import path from 'node:path';
import { startApiServer } from '@server/api-server';
import { loadConfig } from '@server/config/config';
import { startPostgresCluster } from './postgres-cluster';
import { startMailCatcher } from './mail-catcher';
import { startStorageBackend } from './storage-backend';
import { appBuildIsStale, buildApp, startDevServer } from '@server/system/angular-build';
import { configureLog } from '@server/system/log';
import { portAnswers } from '@server/system/port-answers';
import { withProgress } from '@server/system/progress-lines';
import { superviseWorker } from '@server/worker/worker-supervisor';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@seeders/data/demo-people';

/**
 * `npm start`: the project's own PostgreSQL and mail catcher (unless the environment names real
 * ones), the local fake S3 server when BELLKEEP_STORAGE=s3 names no endpoint, migrations and
 * demo data, the built app, and the API; stops what it started on Ctrl-C.
 * `--dev` serves the app with Angular's dev server and its proxy instead of the build.
 */
/** What to undo on the way out, in the order things were started. */
const stops: Array<{ what: string; stop: () => void | Promise<void> }> = [];
/** A step of the stop that takes longer is left behind, so the steps after it (PostgreSQL last) still run. */
const STOP_STEP_MS = 15_000;

/** Undoes every start, last first; a step that fails or hangs is reported and passed over. */
async function stopAll(): Promise<void> {
  for (const { what, stop } of stops.splice(0).reverse()) {
    let timer: NodeJS.Timeout | undefined;
    const late = new Promise<'late'>((resolve) => (timer = setTimeout(() => resolve('late'), STOP_STEP_MS)));
    try {
      if ((await Promise.race([Promise.resolve().then(stop), late])) === 'late') say(`  ${what}: still stopping after ${STOP_STEP_MS / 1000} s; going on`);
    } catch (error) {
      say(`  ${what}: ${error instanceof Error ? error.message : String(error)}`);
    } finally {
      clearTimeout(timer);
    }
  }
}

async function main(): Promise<void> {
  const devMode = process.argv.includes('--dev');
  const config = loadConfig();
  fs.mkdirSync(config.dataDir, { recursive: true });
  // A second `npm start` would fail later, on the port, less clearly.
  if (await portAnswers(config.host, config.port)) {
    throw new Error(
      `something already listens on ${config.host}:${config.port}: is Bellkeep running in another terminal? Open ${config.publicUrl}, or stop that one first (Ctrl-C there).`,
    );
  }

  let databaseUrl = config.databaseUrl;
  if (!databaseUrl) {
    const cluster = await startPostgresCluster({ folder: path.join(config.dataDir, 'postgres'), port: config.postgresPort, database: 'bellkeep' });
    if (cluster.startedHere) stops.push({ what: 'PostgreSQL', stop: () => cluster.stop() });
    databaseUrl = cluster.url;
    say(`PostgreSQL   127.0.0.1:${config.postgresPort} (${cluster.startedHere ? 'started' : 'already running'}; data in ${cluster.folder})`);
  }

  let smtpUrl = config.smtpUrl;
  if (!smtpUrl) {
    const mailFolder = path.join(config.dataDir, 'mail');
    fs.mkdirSync(mailFolder, { recursive: true });
    const catcher = await startMailCatcher(config.mailCatcher.smtpPort, config.mailCatcher.webPort, mailFolder);
    stops.push({ what: 'the mail catcher', stop: () => catcher.stop() });
    smtpUrl = catcher.smtpUrl;
    say(`Mail catcher SMTP 127.0.0.1:${config.mailCatcher.smtpPort}, inbox ${catcher.inboxUrl}`);
  }

  // The terminal stays for people; the structured log (every request, job and mail, by request id) goes to a file.
  const logFile = config.log.file ?? path.join(config.dataDir, 'logs', 'bellkeep.log');
  configureLog({ level: config.log.level, file: logFile });
  say(`Log          ${logFile} (JSON lines, ${config.log.level} and above)`);

  const archive = await startStorageBackend(config);
  stops.push({ what: 'the archive', stop: () => archive.stop() });
  say(`Archive      ${archive.description}`);
  const started = { ...config, storage: archive.storage };

  // The API listens while the app is built: it serves the build once there is one.
  const building = !devMode && appBuildIsStale(config.appDir) ? withProgress('Building the app (ng build)', buildApp(), say) : Promise.resolve();
  building.catch(() => undefined); // awaited below; a failure must not count as unhandled before then
  const api = await withProgress('Database     migrations and the demo lab', startApiServer(started, { databaseUrl, smtpUrl }, { history: false }), say);
  stops.push({ what: 'the API', stop: () => api.stop() });
  const { report } = api;
  say(`Database     ${report.migrations.length} migration(s) applied, ${report.seeders.length} seeder(s) run`);
  if (report.createdAdmin) say(`First admin  ${report.createdAdmin} (from BELLKEEP_ADMIN_EMAIL)`);
  const worker = superviseWorker(
    { BELLKEEP_DATABASE_URL: databaseUrl, BELLKEEP_SMTP_URL: smtpUrl, BELLKEEP_LOG_FILE: logFile, ...archive.workerEnvironment },
    say,
    api.recordWorkerEnd,
  );
  stops.push({ what: 'the worker', stop: () => worker.stop() });
  await building;

  let openUrl = config.publicUrl;
  if (devMode) {
    const devServer = startDevServer();
    stops.push({ what: 'the dev server', stop: () => devServer.stop() });
    openUrl = devServer.url;
  }
  say(`\nBellkeep is running: open ${openUrl}`);
  if (config.demo) {
    say(`Demo sign-ins (password ${DEMO_PASSWORD}):`);
    for (const person of DEMO_PEOPLE) say(`  ${person.email.padEnd(34)} ${person.roles.join(', ')}`);
  }
  say('Ctrl-C stops it.');
  if (config.demoHistory) seedHistoryMeanwhile(api);
}

/**
 * The demo lab's three weeks of nights, analysed while the app already serves (the Runs screen
 * fills when they are in, all at once: one transaction); a line every 5 s says how far it is.
 */
function seedHistoryMeanwhile(api: { seedHistory(onProgress: (done: number, total: number) => void): Promise<string[]> }): void {
  let progress = '';
  void withProgress(
    'Demo history (the app already serves)',
    api.seedHistory((done, total) => (progress = `night ${done} of ${total}`)),
    say,
    () => progress,
  ).then(
    (seeders) => seeders.length === 0 || say(`Demo history ${seeders.length} seeder(s) run: the Runs screen has three weeks of nights`),
    (error: unknown) => say(`Demo history could not be seeded: ${error instanceof Error ? error.message : String(error)}`),
  );
}

/**
 * One stop however many signals come: npm and tsx pass a signal on to this process, which the
 * process-group signal has already reached, so the same Ctrl-C or SIGTERM arrives two or three
 * times. Handlers stay installed, so a repeat never falls back to Node's default (exit at once,
 * leaving the rest running).
 */
let stopping = false;
function shutDown(): void {
  if (stopping) return;
  stopping = true;
  say('\nStopping Bellkeep...');
  void stopAll().finally(() => {
    say('Stopped.');
    process.exit(0);
  });
}
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(signal, shutDown);

function say(line: string): void {
  process.stdout.write(`${line}\n`);
}

main().catch(async (error: unknown) => {
  process.stderr.write(`Bellkeep could not start: ${error instanceof Error ? error.message : String(error)}\n`);
  await stopAll();
  process.exit(1);
});
