import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { RunDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { configureLog, log } from '@server/system/log';
import { fixtureLog, setupId, waitForFinishedRun } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

interface LogLine {
  msg: string;
  requestId?: string;
  queue?: string;
  runId?: number;
  req?: { id: string; method: string; path: string };
  res?: { status: number };
}

describe('the structured log, followed by request id', () => {
  let folder: string;
  let file: string;
  let testApp: TestApp;

  beforeAll(async () => {
    folder = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-log-'));
    file = path.join(folder, 'bellkeep.log');
    configureLog({ level: 'info', file });
    testApp = await createTestApp();
    await testApp.startWorker();
  });
  afterAll(async () => {
    await testApp.close();
    fs.rmSync(folder, { recursive: true, force: true });
  });

  const lines = async (): Promise<LogLine[]> => {
    await new Promise<void>((resolve) => log.flush(() => resolve()));
    return fs
      .readFileSync(file, 'utf8')
      .trim()
      .split('\n')
      .map((line) => JSON.parse(line) as LogLine);
  };

  it('follows one upload from the request to the analysis and the mail, and never writes a token or password', async () => {
    const token = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    const fen = await setupId(testApp.app, token, 'Fen link');
    const uploaded = await request(testApp.app)
      .post('/api/runs')
      .set('Authorization', `Bearer ${token}`)
      .set('X-Request-Id', 'fen-night-upload-0042')
      .field('setupId', String(fen))
      .attach('log', fixtureLog('accepted-run.csv'))
      .expect(201);
    expect(uploaded.headers['x-request-id']).toBe('fen-night-upload-0042');
    const run = await waitForFinishedRun(testApp.app, token, (uploaded.body as RunDto).id);

    let traced: LogLine[] = [];
    for (let attempt = 0; !traced.some((line) => line.msg === 'verdict mail sent'); attempt++) {
      if (attempt > 100) throw new Error(`no mail line for the request; its lines: ${JSON.stringify(traced)}`);
      await new Promise((resolve) => setTimeout(resolve, 100));
      traced = (await lines()).filter((line) => line.requestId === 'fen-night-upload-0042' || line.req?.id === 'fen-night-upload-0042');
    }
    expect(traced.map((line) => [line.msg, line.queue ?? line.req?.path ?? null])).toEqual([
      ['request completed', '/api/runs'],
      ['job started', 'run-analysis'],
      ['analysis finished', null],
      ['job done', 'run-analysis'],
      ['job started', 'verdict-mail'],
      ['verdict mail sent', null],
      ['job done', 'verdict-mail'],
    ]);
    expect(traced.find((line) => line.msg === 'analysis finished')!.runId).toBe(run.id);

    const everything = fs.readFileSync(file, 'utf8');
    expect(everything).not.toContain(token);
    expect(everything).not.toContain(DEMO_PASSWORD);
    expect(everything).not.toContain(run.seed ?? 'no seed');
  });

  it('gives a request without an id, or with one that is not well formed, an id of its own', async () => {
    const plain = await request(testApp.app).get('/api/health').expect(200);
    const odd = await request(testApp.app).get('/api/health').set('X-Request-Id', 'two words\u00e9').expect(200);
    for (const answer of [plain, odd]) expect(answer.headers['x-request-id']).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/);
  });
});
