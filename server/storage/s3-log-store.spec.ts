import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { HeadBucketCommand, PutObjectCommand } from '@aws-sdk/client-s3';
import { archiveContents } from '@tests/support/archive-contents';
import { startTestS3Fake, type TestS3Fake } from '@tests/support/test-s3-fake';
import { describeLogStoreContract, randomLog } from '@tests/support/log-store-contract';
import { putLog, StoredLogCorruptError } from './log-store';
import { createS3LogStore } from './s3-log-store';

let fake: TestS3Fake;

describeLogStoreContract(
  'the S3 bucket (local fake)',
  async () => {
    fake = await startTestS3Fake();
    const store = createS3LogStore(fake.storage);
    return {
      store,
      config: { storage: fake.storage, dataDir: fake.folder },
      // Overwritten through the S3 API, metadata and all: only the bytes no longer match the name.
      tamper: async (sha256, bytes) => {
        await store.client.send(new PutObjectCommand({ Bucket: store.bucket, Key: store.keyOf(sha256), Body: bytes, Metadata: { sha256 } }));
      },
    };
  },
  () => fake.stop(),
);

describe('the S3 bucket beyond the contract', () => {
  let s3: TestS3Fake;
  let workFolder: string;
  beforeAll(async () => {
    s3 = await startTestS3Fake();
    workFolder = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-s3-work-'));
  }, 60_000);
  afterAll(async () => {
    fs.rmSync(workFolder, { recursive: true, force: true });
    await s3.stop();
  });

  it('needs an endpoint: only `npm start` runs the fake when none is set', () => {
    expect(() => createS3LogStore({ ...s3.storage, endpoint: undefined })).toThrow(/Set BELLKEEP_S3_ENDPOINT/);
  });

  it('creates a missing bucket on prepare, and a second process preparing the same bucket is fine', async () => {
    const storage = { ...s3.storage, bucket: 'bellkeep-made-on-start' };
    const first = createS3LogStore(storage);
    await expect(first.client.send(new HeadBucketCommand({ Bucket: storage.bucket }))).rejects.toThrow();
    await first.prepare();
    await first.client.send(new HeadBucketCommand({ Bucket: storage.bucket }));
    await createS3LogStore(storage).prepare();
  });

  it('stores each log under logs/<ab>/<sha256> with its hash as metadata, and refuses an object whose metadata names other bytes', async () => {
    const store = createS3LogStore(s3.storage);
    const log = randomLog(4096);
    await putLog(store, log.source());
    expect(store.keyOf(log.sha256)).toBe(`logs/${log.sha256.slice(0, 2)}/${log.sha256}`);

    const other = crypto.randomBytes(16).toString('hex').padEnd(64, '0');
    await store.client.send(new PutObjectCommand({ Bucket: store.bucket, Key: store.keyOf(log.sha256), Body: log.bytes, Metadata: { sha256: other } }));
    const failure = await new Promise((resolve) => store.read(log.sha256).on('error', resolve).resume());
    expect(failure).toBeInstanceOf(StoredLogCorruptError);
    expect((failure as Error).message).toMatch(new RegExp(`s3://${s3.storage.bucket}/logs/${log.sha256.slice(0, 2)}/${log.sha256}.*metadata is ${other}`));

    // A worker's copy of changed bytes fails the same way, and is not left in its work folder.
    await expect(store.withLocalFile(log.sha256, workFolder, () => Promise.resolve('analysed'))).rejects.toBeInstanceOf(StoredLogCorruptError);
    expect(fs.readdirSync(workFolder)).toEqual([]);
  });

  it('copies a log over the single-copy limit to its key part by part (as logs over 5 GiB are on S3), leaving no parts', async () => {
    const store = createS3LogStore(s3.storage, { singleCopyMaxBytes: 5 * 1024 ** 2, partBytes: 5 * 1024 ** 2 });
    const log = randomLog(12 * 1024 * 1024 + 17);
    expect(await putLog(store, log.source())).toMatchObject({ sha256: log.sha256, isNew: true });
    expect(await store.withLocalFile(log.sha256, workFolder, async (file) => (await fs.promises.readFile(file)).equals(log.bytes))).toBe(true);
    expect((await archiveContents({ storage: s3.storage, dataDir: s3.folder })).leftovers).toEqual([]);
  }, 60_000);
});
