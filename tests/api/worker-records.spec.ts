import os from 'node:os';
import request from 'supertest';
import type { WorkersOverviewDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { fixtureLog, setupId, uploadLog } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

describe('the analysis workers as the admins see them', () => {
  let testApp: TestApp;
  let adminToken: string;
  const overview = async () => (await request(testApp.app).get('/api/workers').set('Authorization', `Bearer ${adminToken}`).expect(200)).body as WorkersOverviewDto;
  const thisHost = (pid: number) => `${os.hostname()}:${pid}`;

  beforeAll(async () => {
    testApp = await createTestApp();
    adminToken = await testApp.signIn('maren.holt@kestrelfen.example', DEMO_PASSWORD);
  });
  afterAll(() => testApp.close());

  it('shows a started worker taking jobs, then stopped when asked', async () => {
    expect(await overview()).toMatchObject({ workers: [], takingJobs: 0, attention: null });
    const worker = await testApp.startWorker();
    const running = await overview();
    expect(running.takingJobs).toBe(1);
    expect(running.workers).toEqual([expect.objectContaining({ name: thisHost(process.pid), condition: 'taking-jobs', endedAt: null })]);

    await worker.stop();
    const stopped = (await overview()).workers[0];
    expect(stopped).toMatchObject({ condition: 'stopped', endedHow: 'stopped when asked' });
    expect(Date.parse(stopped.endedAt!)).toBeGreaterThanOrEqual(Date.parse(stopped.startedAt));
  });

  it('says that no worker takes jobs while runs wait', async () => {
    const experimentalist = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    await uploadLog(testApp.app, experimentalist, fixtureLog('accepted-run.csv'), { setupId: await setupId(testApp.app, experimentalist, 'Fen link') }).expect(201);
    const waiting = await overview();
    expect(waiting.waitingRuns).toBe(1);
    expect(waiting.attention).toMatch(/^No analysis worker takes jobs, and 1 run waits\./);
  });

  it('counts workers that ended unasked or went silent in the last hour, and says when one keeps dying', async () => {
    const { workers } = testApp.services;
    for (const how of ['killed (SIGKILL)', 'exit code 1']) {
      const presence = await workers.announce();
      await workers.recordUnaskedEnd(process.pid, how);
      await presence.stop();
    }
    const silent = await workers.announce();
    await testApp.database.models.WorkerRecord.update({ seenAt: new Date(Date.now() - 60_000) }, { where: { id: silent.id } });

    const seen = await overview();
    // Newest first; a stop() after the supervisor recorded an unasked end keeps that end.
    expect(seen.workers.slice(0, 3).map((worker) => [worker.condition, worker.endedHow])).toEqual([
      ['silent', null],
      ['ended-unasked', 'exit code 1'],
      ['ended-unasked', 'killed (SIGKILL)'],
    ]);
    expect(seen.lostInLastHour).toBe(3);
    expect(seen.attention).toMatch(/^Analysis workers ended unasked or went silent 3 times in the last hour: one keeps dying\./);
    await silent.stop();
  });

  it('is for admins only', async () => {
    const auditor = await testApp.signIn('sami.virtanen@kestrelfen.example', DEMO_PASSWORD);
    await request(testApp.app).get('/api/workers').set('Authorization', `Bearer ${auditor}`).expect(403);
  });
});
