import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type { LoginResponse, RunDto, SetupDto, WorkersOverviewDto } from '@shared/api';
import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';
import { writeModelLog } from '@fixtures/model-log-file';
import { PROJECT_ROOT } from '@server/config/config';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { api, processesOf, startBellkeep, startFolder, untilClosed } from '../support/started-bellkeep';

jest.setTimeout(180_000);

describe('npm start as a lab runs it: starting, stopping, and a worker that dies', () => {
  const folders: string[] = [];
  const dataFolder = () => {
    const folder = startFolder();
    folders.push(folder);
    return folder;
  };
  afterAll(() => {
    for (const folder of folders) fs.rmSync(folder, { recursive: true, force: true });
  });

  it('SIGTERM to its process group stops every process it started, PostgreSQL too; a second start says one is running', async () => {
    const started = await startBellkeep(dataFolder());
    await started.waitFor('Bellkeep is running');

    const second = spawnSync(process.execPath, ['--import', 'tsx', path.join(PROJECT_ROOT, 'local-stack', 'start.ts')], {
      cwd: PROJECT_ROOT,
      encoding: 'utf8',
      env: { ...process.env, BELLKEEP_DATA_DIR: started.dataDir, BELLKEEP_PORT: String(started.ports[0]), BELLKEEP_PG_PORT: String(started.ports[1]) },
    });
    expect(second.status).toBe(1);
    expect(second.stderr).toContain(`something already listens on 127.0.0.1:${started.ports[0]}: is Bellkeep running in another terminal?`);

    // The same signal reaches every process of the group, and npm and tsx would pass it on again.
    process.kill(-started.child.pid!, 'SIGTERM');
    await untilClosed(started.ports);
    await started.waitFor('Stopped.');
    expect(processesOf(started.dataDir)).toEqual([]);
  });

  it('a start killed outright (SIGKILL) still leaves no PostgreSQL and no worker behind', async () => {
    const started = await startBellkeep(dataFolder());
    await started.waitFor('is taking analysis jobs');
    const workerPid = Number(/Worker (\d+) is taking analysis jobs/.exec(started.output())![1]);
    process.kill(started.child.pid!, 'SIGKILL');
    // The cluster's guardian stops it; the worker sees its starter gone.
    await untilClosed([started.ports[1]]);
    const deadline = Date.now() + 20_000;
    while (spawnSync('kill', ['-0', String(workerPid)]).status === 0 && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 200));
    expect(spawnSync('kill', ['-0', String(workerPid)]).status).not.toBe(0);
    expect(processesOf(path.join(started.dataDir, 'postgres'))).toEqual([]);
    process.kill(-started.child.pid!, 'SIGKILL'); // the mail catcher, which nothing guards
  });

  it('a worker killed mid-analysis is started again, and the run ends once, with one result and one mail', async () => {
    const dataDir = dataFolder();
    const log = path.join(dataDir, 'long-night.csv');
    await writeModelLog(log, { ...steadyPair, rounds: 3_000_000 }, FIXTURE_SEED);
    const started = await startBellkeep(dataDir, { BELLKEEP_ANALYSIS_EXPIRE_SECONDS: '4', BELLKEEP_QUEUE_MAINTENANCE_SECONDS: '1', BELLKEEP_QUEUE_POLLING_SECONDS: '0.5' });
    try {
      await started.waitFor('is taking analysis jobs');
      const { token } = await api<LoginResponse>(started.baseUrl, '/api/auth/login', {
        method: 'POST',
        body: JSON.stringify({ email: 'dev.okafor@kestrelfen.example', password: DEMO_PASSWORD }),
      });
      const setups = await api<SetupDto[]>(started.baseUrl, '/api/setups', { token });
      const form = new FormData();
      form.set('setupId', String(setups.find((setup) => setup.name === 'Fen link')!.id));
      form.set('log', new Blob([fs.readFileSync(log)]), 'long-night.csv');
      const queued = await api<RunDto>(started.baseUrl, '/api/runs', { method: 'POST', body: form, token });

      let run = queued;
      for (const deadline = Date.now() + 60_000; run.state !== 'analysing' || run.progress === 0;) {
        if (Date.now() > deadline) throw new Error(`Run ${run.id} never started analysing: ${run.state}`);
        await new Promise((resolve) => setTimeout(resolve, 50));
        run = await api<RunDto>(started.baseUrl, `/api/runs/${queued.id}`, { token });
      }
      const killedPid = Number(run.analysedBy!.split(':').pop());
      process.kill(killedPid, 'SIGKILL');
      await started.waitFor(`Worker ${killedPid} ended, killed (SIGKILL); starting another in 1 s`);

      for (const deadline = Date.now() + 120_000; !['accepted', 'aborted', 'invalid', 'failed'].includes(run.state);) {
        if (Date.now() > deadline) throw new Error(`Run ${run.id} still ${run.state}`);
        await new Promise((resolve) => setTimeout(resolve, 250));
        run = await api<RunDto>(started.baseUrl, `/api/runs/${queued.id}`, { token });
      }
      expect(run.verdict).toBe('ACCEPT');
      expect(run.attempts).toBe(2);
      expect(Number(run.analysedBy!.split(':').pop())).not.toBe(killedPid);
      // One mail, however the attempts went.
      for (const deadline = Date.now() + 30_000; run.deliveries.length === 0 && Date.now() < deadline;) {
        await new Promise((resolve) => setTimeout(resolve, 250));
        run = await api<RunDto>(started.baseUrl, `/api/runs/${queued.id}`, { token });
      }
      expect(run.deliveries.map((delivery) => delivery.status)).toEqual(['sent']);

      // The admins see the killed worker and the one started in its place.
      const admin = await api<LoginResponse>(started.baseUrl, '/api/auth/login', {
        method: 'POST',
        body: JSON.stringify({ email: 'maren.holt@kestrelfen.example', password: DEMO_PASSWORD }),
      });
      const { workers, lostInLastHour } = await api<WorkersOverviewDto>(started.baseUrl, '/api/workers', { token: admin.token });
      expect(workers.find((worker) => worker.name.endsWith(`:${killedPid}`))).toMatchObject({ condition: 'ended-unasked', endedHow: 'killed (SIGKILL)' });
      expect(workers.filter((worker) => worker.condition === 'taking-jobs')).toHaveLength(1);
      expect(lostInLastHour).toBe(1);
    } finally {
      process.kill(-started.child.pid!, 'SIGTERM');
      await untilClosed(started.ports);
    }
  });
});
