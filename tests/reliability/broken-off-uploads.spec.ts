import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import type { RunDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { settledArchiveContents } from '../support/archive-contents';
import { modelLog } from '../support/model-logs';
import { breakOffPatch, createResumableUpload, patchUpload, uploadOffset } from '../support/resumable-api';
import { breakOffUpload, setupId, uploadLog } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(60_000);

/** Waits until `size` finds bytes (a file the server is writing), and returns how many. */
async function untilBytes(size: () => number, timeoutMs = 15_000): Promise<number> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const bytes = size();
    if (bytes > 0) return bytes;
    if (Date.now() > deadline) throw new Error(`No bytes arrived in ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

/** Size of the first file in `folder`, 0 when there is none. */
function firstFileSize(folder: string): number {
  const [first] = fs.existsSync(folder) ? fs.readdirSync(folder) : [];
  return first === undefined ? 0 : fs.statSync(path.join(folder, first)).size;
}

/**
 * Uploads whose client goes away half-way, over real sockets: whatever the server was writing is
 * removed (multipart) or kept only as the resumable upload's own partial (tus), no run and no
 * archive record appear, and the server goes on answering.
 */
describe('uploads broken off mid-stream', () => {
  let testApp: TestApp;
  let token: string;
  let fenLink: number;

  beforeAll(async () => {
    testApp = await createTestApp();
    token = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    fenLink = await setupId(testApp.app, token, 'Fen link');
  });
  afterAll(() => testApp.close());

  /** What the upload could have left behind: runs, archive records and archived logs. */
  async function records() {
    const { models } = testApp.database;
    return { runs: await models.Run.count(), archiveRecords: await models.ArchiveFile.count(), archived: (await settledArchiveContents(testApp.config)).kept };
  }

  it('a multipart upload cut off leaves no partial file, no run and no archive record, and the server takes the next upload', async () => {
    const before = await records();
    const receiving = path.join(testApp.config.dataDir, 'uploads');
    let receivedBeforeBreaking = 0;
    await breakOffUpload(testApp.app, token, fenLink, '0,0,1,0,0\n'.repeat(200_000), async () => {
      receivedBeforeBreaking = await untilBytes(() => firstFileSize(receiving));
    });
    // The server had begun writing the log, and drops it once the request is gone.
    expect(receivedBeforeBreaking).toBeGreaterThan(0);
    expect((await settledArchiveContents(testApp.config)).leftovers).toEqual([]);
    expect(await records()).toEqual(before);

    await request(testApp.app).get('/api/health').expect(200);
    await uploadLog(testApp.app, token, modelLog(4000, 1), { setupId: fenLink }).expect(201);
  });

  it('a resumable PATCH cut off keeps only the partial it goes on from: no run, no archive record, and the upload then finishes', async () => {
    const log = modelLog(200_000, 2);
    const before = await records();
    const location = await createResumableUpload(testApp.app, token, log.bytes.length, { setupId: fenLink, filename: log.name });
    const partial = path.join(testApp.config.dataDir, 'resumable-uploads', location.split('/').pop()!);
    await breakOffPatch(testApp.app, token, location, log.bytes, () => untilBytes(() => (fs.existsSync(partial) ? fs.statSync(partial).size : 0)));

    // The upload's lock goes when the server sees the request closed; until then HEAD may wait or answer 423.
    let head = await uploadOffset(testApp.app, token, location);
    for (let tries = 0; head.status !== 200 && tries < 50; tries++) {
      await new Promise((resolve) => setTimeout(resolve, 100));
      head = await uploadOffset(testApp.app, token, location);
    }
    expect(head.status).toBe(200);
    expect(head.offset).toBeGreaterThan(0);
    expect(head.offset).toBeLessThanOrEqual(log.bytes.length >> 1);
    expect(fs.statSync(partial).size).toBe(head.offset);
    expect((await settledArchiveContents(testApp.config)).leftovers).toEqual([]);
    expect(await records()).toEqual(before);

    const finished = await patchUpload(testApp.app, token, location, head.offset!, log.bytes.subarray(head.offset!)).expect(201);
    expect((finished.body as RunDto).file.sha256).toBe(crypto.createHash('sha256').update(log.bytes).digest('hex'));
    expect(fs.existsSync(partial)).toBe(false);
  });
});
