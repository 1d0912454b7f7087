import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { DeleteObjectCommand, PutObjectCommand } from '@aws-sdk/client-s3';
import request from 'supertest';
import type { ApiErrorBody, RunDto, VerificationDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { createS3LogStore, type S3LogStore } from '@server/storage/s3-log-store';
import { archiveContents, settledArchiveContents } from '../support/archive-contents';
import { breakOffUpload, fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

/** Larger than one 8 MiB part of the store's multipart upload, so the limit cuts a multipart upload short. */
const UPLOAD_LIMIT = 10 * 1024 * 1024;

describe('the runs pipeline with the archive in S3 (the local fake)', () => {
  let testApp: TestApp;
  let bucket: S3LogStore;
  let dev: string;
  let fen: number;
  const bearer = () => ({ Authorization: `Bearer ${dev}` });

  beforeAll(async () => {
    testApp = await createTestApp({ BELLKEEP_STORAGE: 's3', BELLKEEP_UPLOAD_LIMIT_BYTES: String(UPLOAD_LIMIT) });
    if (testApp.config.storage.kind !== 's3') throw new Error('the test app should archive in S3');
    bucket = createS3LogStore(testApp.config.storage);
    await testApp.startWorker();
    dev = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    fen = await setupId(testApp.app, dev, 'Fen link');
  }, 60_000);
  afterAll(() => testApp.close());

  const verification = async (id: number) => (await request(testApp.app).get(`/api/runs/${id}/verification`).set(bearer()).expect(200)).body as VerificationDto;
  const archiveCheck = async (id: number) => (await verification(id)).checks.find((check) => check.check === 'archive-file')!;

  it('upload → object in the bucket → verdict from a worker’s checked copy; the verification re-reads the object and names a changed or missing one', async () => {
    const bytes = fs.readFileSync(fixtureLog('accepted-run.csv'));
    const sha256 = crypto.createHash('sha256').update(bytes).digest('hex');
    const queued = (await uploadLog(testApp.app, dev, fixtureLog('accepted-run.csv'), { setupId: fen }).expect(201)).body as RunDto;
    expect(queued.file.sha256).toBe(sha256);
    expect(await archiveContents(testApp.config)).toEqual({ kept: [sha256], leftovers: [] });

    const run = await waitForFinishedRun(testApp.app, dev, queued.id);
    expect(run).toMatchObject({ state: 'accepted', verdict: 'ACCEPT' });
    expect((run.result as { input: { sha256: string } }).input.sha256).toBe(sha256);
    expect(fs.readdirSync(testApp.config.workDir)).toEqual([]);
    expect(await verification(run.id)).toMatchObject({ intact: true });

    const changed = Buffer.from(bytes);
    changed[changed.lastIndexOf(Buffer.from(',1')) + 1] = '0'.charCodeAt(0);
    await bucket.client.send(new PutObjectCommand({ Bucket: bucket.bucket, Key: bucket.keyOf(sha256), Body: changed, Metadata: { sha256 } }));
    const changedCheck = await archiveCheck(run.id);
    expect(changedCheck.passed).toBe(false);
    expect(changedCheck.detail).toContain('its bytes were changed');

    await bucket.client.send(new DeleteObjectCommand({ Bucket: bucket.bucket, Key: bucket.keyOf(sha256) }));
    const missingCheck = await archiveCheck(run.id);
    expect(missingCheck.passed).toBe(false);
    expect(missingCheck.detail).toContain('it is missing');
  }, 60_000);

  it('the same bytes again make a duplicate run of the one object', async () => {
    const first = (await uploadLog(testApp.app, dev, fixtureLog('drifting-run.csv'), { setupId: fen }).expect(201)).body as RunDto;
    const second = (await uploadLog(testApp.app, dev, fixtureLog('drifting-run.csv'), { setupId: fen }).expect(201)).body as RunDto;
    expect(second.duplicateOf).toBe(first.id);
    const { kept, leftovers } = await archiveContents(testApp.config);
    expect(kept.filter((sha256) => sha256 === first.file.sha256)).toHaveLength(1);
    expect(leftovers).toEqual([]);
  });

  it('a log over the upload limit gets 413 once its multipart upload is aborted: no run, no object, no parts', async () => {
    const runsBefore = await testApp.database.models.Run.count();
    const keptBefore = (await archiveContents(testApp.config)).kept;
    const tooLarge = path.join(testApp.config.dataDir, 'too-large.csv');
    fs.writeFileSync(tooLarge, `round,x,y,a,b\n${'0,0,1,0,0\n'.repeat(1_200_000)}`);
    const response = await uploadLog(testApp.app, dev, tooLarge, { setupId: fen }).expect(413);
    expect((response.body as ApiErrorBody).error.message).toMatch(/upload limit/);
    expect(await archiveContents(testApp.config)).toEqual({ kept: keptBefore, leftovers: [] });
    expect(await testApp.database.models.Run.count()).toBe(runsBefore);
  }, 60_000);

  it('an upload broken off while its multipart upload is under way leaves no run, no object and no parts', async () => {
    const runsBefore = await testApp.database.models.Run.count();
    const keptBefore = (await archiveContents(testApp.config)).kept;
    await breakOffUpload(testApp.app, dev, fen, '0,0,1,0,0\n'.repeat(900_000), async () => {
      while ((await archiveContents(testApp.config)).leftovers.length === 0) await new Promise((resolve) => setTimeout(resolve, 20));
    });
    expect(await settledArchiveContents(testApp.config)).toEqual({ kept: keptBefore, leftovers: [] });
    expect(await testApp.database.models.Run.count()).toBe(runsBefore);
  }, 60_000);
});
