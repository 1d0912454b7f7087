import type { ChildProcess } from 'node:child_process';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { RunDto } from '../../shared/api';
import { spawnWorkerProcess, stopWorkerProcess } from '../../server/worker/worker-process';
import { FIXTURE_SEED, steadyPair } from '../../fixtures/fixture-set';
import { writeModelLog } from '../../fixtures/model-log-file';
import { DEMO_PASSWORD } from '../../seeders/data/demo-people';
import { createTestApp, type TestApp } from '../support/test-app';
import { fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';

/** A worker that stops answering is taken for dead after 8 s: longer than any analysis here. */
const WORKER_ENVIRONMENT = { BELLKEEP_ANALYSIS_EXPIRE_SECONDS: '8', BELLKEEP_QUEUE_MAINTENANCE_SECONDS: '1', BELLKEEP_QUEUE_POLLING_SECONDS: '0.5' };

/** A worker process like `npm run worker`, on the test app's database, archive and mail catcher. */
function spawnWorker(testApp: TestApp): ChildProcess {
  return spawnWorkerProcess({
    ...WORKER_ENVIRONMENT,
    BELLKEEP_DATABASE_URL: testApp.database.url,
    BELLKEEP_SMTP_URL: testApp.mailCatcher.smtpUrl,
    BELLKEEP_DATA_DIR: testApp.config.dataDir,
  });
}

describe('two worker processes on one database', () => {
  let testApp: TestApp;
  let dev: string;
  let bigLog: string;
  const workers: ChildProcess[] = [];

  beforeAll(async () => {
    testApp = await createTestApp(WORKER_ENVIRONMENT);
    dev = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    // Large enough that its analysis takes a second or so: time to stop its worker mid-way.
    bigLog = path.join(testApp.config.dataDir, 'long-night.csv.gz');
    await writeModelLog(bigLog, { ...steadyPair, rounds: 6_000_000 }, FIXTURE_SEED, { gzip: true });
    workers.push(spawnWorker(testApp), spawnWorker(testApp));
  }, 120_000);

  afterAll(async () => {
    await Promise.all(workers.map(stopWorkerProcess));
    await testApp.close();
  });

  it('share the work, analyse every run exactly once, and retry the run of a worker killed mid-analysis on the other', async () => {
    const fen = await setupId(testApp.app, dev, 'Fen link');
    const big = (await uploadLog(testApp.app, dev, bigLog, { setupId: fen }).expect(201)).body as RunDto;
    const small: RunDto[] = [];
    for (const name of ['accepted-run.csv', 'aborted-low-chsh.csv', 'drifting-run.csv', 'biased-setting-rng.csv', 'malformed-rows.csv']) {
      small.push((await uploadLog(testApp.app, dev, fixtureLog(name), { setupId: fen }).expect(201)).body as RunDto);
    }

    // Kill the worker that holds the long run while it reads.
    let holder: RunDto;
    for (;;) {
      holder = (await request(testApp.app).get(`/api/runs/${big.id}`).set('Authorization', `Bearer ${dev}`)).body as RunDto;
      if (holder.state === 'analysing' && holder.analysedBy) break;
      if (holder.state !== 'queued') throw new Error(`the long run ended (${holder.state}) before it could be interrupted`);
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    const killedPid = Number(holder.analysedBy!.split(':')[1]);
    const killed = workers.find((worker) => worker.pid === killedPid)!;
    killed.kill('SIGKILL');

    const finished = await waitForFinishedRun(testApp.app, dev, big.id, 60_000);
    expect(finished.state).toBe('accepted');
    expect(finished.attempts).toBeGreaterThanOrEqual(2);
    const survivor = workers.find((worker) => worker !== killed)!;
    expect(finished.analysedBy).toBe(`${os.hostname()}:${survivor.pid}`);

    const all = [finished, ...(await Promise.all(small.map((run) => waitForFinishedRun(testApp.app, dev, run.id, 60_000))))];
    expect(all.map((run) => run.state)).toEqual(['accepted', 'accepted', 'aborted', 'accepted', 'aborted', 'invalid']);
    // Exactly one stored result each: one `run.finished` line in each run's trail.
    for (const run of all) {
      const [{ count }] = (await testApp.database.sequelize.query(
        "SELECT count(*)::int AS count FROM audit_events WHERE action = 'run.finished' AND target_id = :id",
        { replacements: { id: String(run.id) }, plain: false, raw: true },
      ))[0] as Array<{ count: number }>;
      expect(count).toBe(1);
    }
    // Both workers took part: the killed one had started the long run, the other finished it.
    const starters = await testApp.database.sequelize.query("SELECT DISTINCT details->>'worker' AS worker FROM audit_events WHERE action = 'run.analysis-started'", { raw: true });
    expect((starters[0] as unknown[]).length).toBe(2);
  }, 120_000);
});
