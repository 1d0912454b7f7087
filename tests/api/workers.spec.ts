import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { RunDto } from '@shared/api';
import { spawnWorkerProcess, stopWorkerProcess, untilTakingJobs } from '@server/worker/worker-process';
import { ENGINE_MALLOC_TUNABLES } from '@shared/analysis/node';
import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';
import { writeModelLog } from '@fixtures/model-log-file';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { createTestApp, type TestApp } from '../support/test-app';
import { fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';

/** A worker that stops answering is taken for dead after 8 s: longer than any analysis here. */
const WORKER_ENVIRONMENT = { BELLKEEP_ANALYSIS_EXPIRE_SECONDS: '8', BELLKEEP_QUEUE_MAINTENANCE_SECONDS: '1', BELLKEEP_QUEUE_POLLING_SECONDS: '0.5' };

const SMALL_LOGS = ['accepted-run.csv', 'aborted-low-chsh.csv', 'drifting-run.csv', 'biased-setting-rng.csv', 'malformed-rows.csv'];

/** Workers like `npm run worker` on other machines: the test app's database, archive and mail catcher, and a work folder each. */
class WorkerPool {
  readonly processes: ChildProcess[] = [];
  readonly folders = new Map<ChildProcess, string>();

  constructor(private readonly testApp: TestApp) {}

  /** Starts a worker (on `workFolder`, else a new one) and waits until it takes jobs. */
  async start(workFolder = fs.mkdtempSync(path.join(this.testApp.config.dataDir, 'work-'))): Promise<ChildProcess> {
    const worker = spawnWorkerProcess({
      ...WORKER_ENVIRONMENT,
      ...this.testApp.storage.workerEnvironment,
      BELLKEEP_DATABASE_URL: this.testApp.database.url,
      BELLKEEP_SMTP_URL: this.testApp.mailCatcher.smtpUrl,
      BELLKEEP_DATA_DIR: this.testApp.config.dataDir,
      BELLKEEP_WORK_DIR: workFolder,
    });
    this.processes.push(worker);
    this.folders.set(worker, workFolder);
    await untilTakingJobs(worker);
    return worker;
  }

  byPid(pid: number): ChildProcess {
    return this.processes.find((worker) => worker.pid === pid)!;
  }

  stopAll(): Promise<void[]> {
    return Promise.all(this.processes.map(stopWorkerProcess));
  }
}

/** Uploads the logs at once (concurrent requests), each as a run of `setup`. */
async function uploadAtOnce(testApp: TestApp, token: string, setup: number, logs: string[]): Promise<RunDto[]> {
  return Promise.all(logs.map(async (log) => (await uploadLog(testApp.app, token, log, { setupId: setup }).expect(201)).body as RunDto));
}

/** How many results were stored for the run: its `run.finished` lines in the trail. */
async function storedResults(testApp: TestApp, runId: number): Promise<number> {
  const [rows] = await testApp.database.sequelize.query("SELECT count(*)::int AS count FROM audit_events WHERE action = 'run.finished' AND target_id = :id", {
    replacements: { id: String(runId) },
  });
  return (rows as Array<{ count: number }>)[0].count;
}

const pidOf = (run: RunDto) => Number(run.analysedBy!.split(':')[1]);

/**
 * The files of a work folder once it is empty, or as they are after `timeoutMs`. An attempt the
 * queue gave up on as expired (a slow machine) may still be running beside its retry, holding its
 * copy until it ends: "no copy left" means none once every attempt has ended.
 */
async function settledFolder(folder: string, timeoutMs = 30_000): Promise<string[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const files = fs.readdirSync(folder);
    if (files.length === 0 || Date.now() > deadline) return files;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

describe('two worker processes with the archive in S3 (the local fake), each with its own work folder', () => {
  let testApp: TestApp;
  let dev: string;
  let pool: WorkerPool;
  let nightLogs: string[];
  let longLog: string;

  beforeAll(async () => {
    testApp = await createTestApp({ ...WORKER_ENVIRONMENT, BELLKEEP_STORAGE: 's3' });
    dev = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    // Four distinct logs whose analyses each outlast a worker's polling interval, so both workers get some.
    nightLogs = [];
    for (let night = 0; night < 4; night++) {
      const log = path.join(testApp.config.dataDir, `night-${night}.csv.gz`);
      await writeModelLog(log, { ...steadyPair, rounds: 1_000_000 }, FIXTURE_SEED.slice(0, 60) + `a${night}00`, { gzip: true });
      nightLogs.push(log);
    }
    // Long enough that its analysis takes a second or more: time to kill its worker mid-way.
    longLog = path.join(testApp.config.dataDir, 'long-night.csv.gz');
    await writeModelLog(longLog, { ...steadyPair, rounds: 6_000_000 }, FIXTURE_SEED, { gzip: true });
    pool = new WorkerPool(testApp);
    await Promise.all([pool.start(), pool.start()]);
  }, 180_000);

  afterAll(async () => {
    await pool.stopAll();
    await testApp.close();
  });

  it('share the work, analyse every run exactly once, retry a run killed mid-analysis on the other, and leave no copies', async () => {
    const fen = await setupId(testApp.app, dev, 'Fen link');
    const [first, second] = pool.processes;
    // Each runs with the engine's allocator settings (shared/analysis/node/engine-memory.ts); glibc
    // rewrites the variable in place as it reads it, so only its first setting shows in /proc.
    const firstSetting = `GLIBC_TUNABLES=${ENGINE_MALLOC_TUNABLES.split(':')[0]}`;
    for (const worker of pool.processes)
      expect(fs.readFileSync(`/proc/${worker.pid}/environ`, 'utf8').split('\0')).toContainEqual(expect.stringMatching(new RegExp(`^${firstSetting}`)));

    const nights = await uploadAtOnce(testApp, dev, fen, nightLogs);
    const analysed = await Promise.all(nights.map((run) => waitForFinishedRun(testApp.app, dev, run.id, 60_000)));
    expect(analysed.map((run) => run.state)).toEqual(['accepted', 'accepted', 'accepted', 'accepted']);
    expect(new Set(analysed.map(pidOf))).toEqual(new Set([first.pid, second.pid]));

    const [long, ...small] = await uploadAtOnce(testApp, dev, fen, [longLog, ...SMALL_LOGS.map(fixtureLog)]);
    // Kill the worker that holds the long run once the engine reads its copy.
    let holder: RunDto;
    for (;;) {
      holder = (await request(testApp.app).get(`/api/runs/${long.id}`).set('Authorization', `Bearer ${dev}`)).body as RunDto;
      if (holder.state === 'analysing' && holder.progress > 0) break;
      if (holder.state !== 'queued' && holder.state !== 'analysing') throw new Error(`the long run ended (${holder.state}) before it could be interrupted`);
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    const killed = pool.byPid(pidOf(holder));
    killed.kill('SIGKILL');
    const survivor = killed === first ? second : first;
    const leftBehind = fs.readdirSync(pool.folders.get(killed)!);
    expect(leftBehind.length).toBeGreaterThan(0);
    for (const file of leftBehind) expect(file).toMatch(/^log-copy-.*\.part$/);

    const finished = await waitForFinishedRun(testApp.app, dev, long.id, 60_000);
    expect(finished).toMatchObject({ state: 'accepted', analysedBy: `${os.hostname()}:${survivor.pid}` });
    expect(finished.attempts).toBeGreaterThanOrEqual(2);
    const rest = await Promise.all(small.map((run) => waitForFinishedRun(testApp.app, dev, run.id, 60_000)));
    expect(rest.map((run) => run.state)).toEqual(['accepted', 'aborted', 'aborted', 'aborted', 'invalid']);
    for (const run of [...analysed, finished, ...rest]) expect(await storedResults(testApp, run.id)).toBe(1);

    // The survivor deleted each copy after use; a worker restarted on the killed one's folder clears what it left.
    expect(await settledFolder(pool.folders.get(survivor)!)).toEqual([]);
    await pool.start(pool.folders.get(killed));
    expect(fs.readdirSync(pool.folders.get(killed)!)).toEqual([]);
  }, 180_000);
});

describe('two worker processes with the local archive', () => {
  let testApp: TestApp;
  let pool: WorkerPool;

  beforeAll(async () => {
    testApp = await createTestApp(WORKER_ENVIRONMENT);
    pool = new WorkerPool(testApp);
    await Promise.all([pool.start(), pool.start()]);
  }, 60_000);

  afterAll(async () => {
    await pool.stopAll();
    await testApp.close();
  });

  it('analyse logs uploaded at once exactly once each, from the archive folder itself', async () => {
    const dev = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    const runs = await uploadAtOnce(testApp, dev, await setupId(testApp.app, dev, 'Fen link'), SMALL_LOGS.map(fixtureLog));
    const finished = await Promise.all(runs.map((run) => waitForFinishedRun(testApp.app, dev, run.id, 60_000)));
    expect(finished.map((run) => run.state)).toEqual(['accepted', 'aborted', 'aborted', 'aborted', 'invalid']);
    for (const run of finished) expect(await storedResults(testApp, run.id)).toBe(1);
    for (const folder of pool.folders.values()) expect(await settledFolder(folder)).toEqual([]);
  }, 60_000);
});
