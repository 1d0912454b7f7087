import path from 'node:path';
import type { Config, S3StorageConfig, StorageConfig } from '@server/config/config';
import { FAKE_S3_CREDENTIALS, startS3Fake } from './s3-fake';

/** What serves the archive for this start, and how other processes reach the same one. */
export interface StorageBackend {
  /** The storage configuration to use from here on (with the fake's address when one was started). */
  storage: StorageConfig;
  /** The variables a worker process needs to reach the same archive. */
  workerEnvironment: Record<string, string>;
  /** One line for the start-up report. */
  description: string;
  /** Stops what was started here (the fake); nothing for a configured store. */
  stop(): Promise<void>;
}

/**
 * Readies the configured archive for `npm start` and the tests: with BELLKEEP_STORAGE=s3 and no
 * endpoint, starts the local fake S3 server on loopback (port BELLKEEP_S3_FAKE_PORT, data under
 * `<dataDir>/s3`) and hands on its address and credentials.
 */
export async function startStorageBackend(config: Pick<Config, 'storage' | 'dataDir'>): Promise<StorageBackend> {
  const { storage } = config;
  if (storage.kind === 'local') {
    return { storage, workerEnvironment: { BELLKEEP_STORAGE: 'local' }, description: `the folder ${path.join(config.dataDir, 'archive')}`, stop: () => Promise.resolve() };
  }
  let started: S3StorageConfig = storage;
  let stop: () => Promise<void> = () => Promise.resolve();
  let description = `s3://${storage.bucket} at ${storage.endpoint}`;
  if (!storage.endpoint) {
    const folder = path.join(config.dataDir, 's3');
    const fake = await startS3Fake({ port: storage.fakePort, folder, bucket: storage.bucket });
    started = { ...storage, endpoint: fake.endpoint, credentials: FAKE_S3_CREDENTIALS };
    stop = fake.stop;
    description = `s3://${storage.bucket} at ${fake.endpoint} (the local fake S3 server; data in ${folder})`;
  }
  const { endpoint, bucket, region, credentials } = started;
  return {
    storage: started,
    workerEnvironment: {
      BELLKEEP_STORAGE: 's3',
      BELLKEEP_S3_ENDPOINT: endpoint!,
      BELLKEEP_S3_BUCKET: bucket,
      BELLKEEP_S3_REGION: region,
      ...(credentials ? { AWS_ACCESS_KEY_ID: credentials.accessKeyId, AWS_SECRET_ACCESS_KEY: credentials.secretAccessKey } : {}),
    },
    description,
    stop,
  };
}
