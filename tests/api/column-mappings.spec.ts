import fs from 'node:fs';
import request from 'supertest';
import type { ApiErrorBody, AuditPageDto, RunDto, SetupDto } from '@shared/api';
import { demoTokens } from '../support/demo-tokens';
import { fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

describe('a column mapping saved per setup', () => {
  let testApp: TestApp;
  let tokens: Record<string, string>;
  const bearer = (who: string) => ({ Authorization: `Bearer ${tokens[who]}` });
  let fenLink: number;
  /** The mapping of the Mill Lane export, whose header names its columns its own way, outcomes ±1. */
  const millLane = JSON.parse(fs.readFileSync(fixtureLog('mill-lane-mapping.json'), 'utf8')) as object;

  beforeAll(async () => {
    testApp = await createTestApp();
    await testApp.startWorker();
    tokens = await demoTokens(testApp, ['dev', 'sami', 'maren']);
    fenLink = await setupId(testApp.app, tokens['dev'], 'Fen link');
  }, 60_000);
  afterAll(() => testApp.close());

  const save = (who: string, body: unknown) =>
    request(testApp.app)
      .put(`/api/setups/${fenLink}/column-mapping`)
      .set(bearer(who))
      .send(body as object);

  it('is saved by whoever uploads, refused when malformed, and kept in the trail field by field', async () => {
    const bad = (await save('dev', { mapping: { columns: { speed: 'v' } } }).expect(400)).body as ApiErrorBody;
    expect(bad.error.message).toContain('speed');
    await save('sami', { mapping: millLane }).expect(403);

    const saved = (await save('dev', { mapping: millLane }).expect(200)).body as SetupDto;
    expect(saved.columnMapping).toEqual(millLane);
    expect(((await request(testApp.app).get(`/api/setups/${fenLink}`).set(bearer('sami')).expect(200)).body as SetupDto).columnMapping).toEqual(millLane);

    const trail = (await request(testApp.app).get('/api/audit').query({ action: 'setup.changed' }).set(bearer('sami')).expect(200)).body as AuditPageDto;
    expect(trail.items[0]).toMatchObject({ actor: 'Dev Okafor', details: { changes: { columnMapping: { from: null, to: millLane } } } });
  });

  it('reads an upload that names no mapping, and the run keeps the mapping it was read with', async () => {
    await save('dev', { mapping: millLane }).expect(200);
    const created = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('mill-lane-export.csv'), { setupId: fenLink }).expect(201)).body as RunDto;
    const run = await waitForFinishedRun(testApp.app, tokens['dev'], created.id);
    expect(run.mapping).toEqual(millLane);
    expect(run.verdict).not.toBe('INVALID');
    expect(run.result?.errorCount).toBe(0);

    // Forgotten, the same file is read under its header's own names again: no column "round".
    expect(((await save('maren', { mapping: null }).expect(200)).body as SetupDto).columnMapping).toBeNull();
    const again = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('mill-lane-export.csv'), { setupId: fenLink, acquiredOn: '2026-12-04' }).expect(201)).body as RunDto;
    const unread = await waitForFinishedRun(testApp.app, tokens['dev'], again.id);
    expect(unread.mapping).toBeNull();
    expect(unread.result?.errors[0].message).toContain('no column "round"');
  }, 60_000);
});
