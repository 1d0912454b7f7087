import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { S3StorageConfig } from '@server/config/config';
import { FAKE_S3_CREDENTIALS, startS3Fake } from '@local-stack/s3-fake';
import { freePort } from './free-port';

export interface TestS3Fake {
  /** Storage configuration that reaches the fake's bucket. */
  storage: S3StorageConfig;
  /** s3rver's folder (tests change objects behind the store's back here). */
  folder: string;
  stop(): Promise<void>;
}

/** The local fake S3 server on a free port and a temporary folder, started as `npm start` starts it. */
export async function startTestS3Fake(bucket = 'bellkeep-test-logs'): Promise<TestS3Fake> {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-s3-'));
  const port = await freePort();
  const fake = await startS3Fake({ port, folder, bucket });
  return {
    storage: { kind: 's3', endpoint: fake.endpoint, bucket, region: 'us-east-1', credentials: FAKE_S3_CREDENTIALS, fakePort: port },
    folder,
    async stop() {
      await fake.stop();
      fs.rmSync(folder, { recursive: true, force: true });
    },
  };
}
