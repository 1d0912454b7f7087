import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { loadConfig } from '@server/config/config';
import { bootstrapDatabase } from '@server/database/bootstrap';
import { startPostgresCluster } from '@local-stack/postgres-cluster';
import { openDatabase } from '@server/database/sequelize';
import { startMailCatcher } from '@local-stack/mail-catcher';
import { FAKE_S3_CREDENTIALS, startS3Fake } from '@local-stack/s3-fake';
import { freePort } from '@tests/support/free-port';
import type { StorageMode } from './options';

const BUCKET = 'bellkeep-bench-logs';

/** What one measurement runs on, in a temporary folder deleted by `stop`. */
export interface ThrowawayLab {
  folder: string;
  /** The environment of the API process: database, mail, signing key, storage, its own data folder. */
  apiEnvironment: Record<string, string>;
  /** The environment of the worker: the same, but a data folder of its own unless the local archive must be shared. */
  workerEnvironment: Record<string, string>;
  stop(): Promise<void>;
}

/**
 * A throwaway PostgreSQL cluster and mail catcher (and for `s3` the S3 fake) on free loopback
 * ports, data folders, and the
 * demo lab's people and setups, seeded here so the API can start with BELLKEEP_DEMO=false and
 * skip the demo history (which would otherwise analyse three weeks of nights before it listens).
 */
export async function startThrowawayLab(storage: StorageMode): Promise<ThrowawayLab> {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), `bellkeep-bench-${storage}-`));
  // mkdtemp makes the folder private; as root the cluster runs as `postgres`, which must enter it.
  fs.chmodSync(folder, 0o755);
  const undo: Array<() => void | Promise<void>> = [() => fs.rmSync(folder, { recursive: true, force: true })];
  const stop = async () => {
    for (const step of undo.splice(0).reverse()) await step();
  };
  try {
    const cluster = await startPostgresCluster({ folder: path.join(folder, 'postgres'), port: await freePort(), database: 'bellkeep' });
    undo.push(() => cluster.stop());
    const mailFolder = path.join(folder, 'mail');
    fs.mkdirSync(mailFolder);
    const catcher = await startMailCatcher(await freePort(), await freePort(), mailFolder);
    undo.push(() => catcher.stop());

    const shared: Record<string, string> = {
      BELLKEEP_DATABASE_URL: cluster.url,
      BELLKEEP_SMTP_URL: catcher.smtpUrl,
      // One key for every process, as a deployment on several machines gives it.
      BELLKEEP_SIGNING_KEY: crypto.generateKeyPairSync('ed25519').privateKey.export({ format: 'pem', type: 'pkcs8' }).toString(),
      BELLKEEP_STORAGE: storage,
      BELLKEEP_DEMO: 'false',
    };
    if (storage === 's3') {
      const fake = await startS3Fake({ port: await freePort(), folder: path.join(folder, 's3'), bucket: BUCKET });
      undo.push(() => fake.stop());
      Object.assign(shared, {
        BELLKEEP_S3_ENDPOINT: fake.endpoint,
        BELLKEEP_S3_BUCKET: BUCKET,
        AWS_ACCESS_KEY_ID: FAKE_S3_CREDENTIALS.accessKeyId,
        AWS_SECRET_ACCESS_KEY: FAKE_S3_CREDENTIALS.secretAccessKey,
      });
    }
    const apiDataDir = path.join(folder, 'api');
    // With S3 the worker shares nothing with the API but the database and the bucket.
    const workerDataDir = storage === 's3' ? path.join(folder, 'worker') : apiDataDir;
    await seedDemoLab({ ...shared, BELLKEEP_DATA_DIR: apiDataDir });
    return {
      folder,
      apiEnvironment: { ...shared, BELLKEEP_DATA_DIR: apiDataDir },
      workerEnvironment: { ...shared, BELLKEEP_DATA_DIR: workerDataDir, BELLKEEP_WORK_DIR: path.join(workerDataDir, 'work') },
      stop,
    };
  } catch (error) {
    await stop();
    throw error;
  }
}

/** Migrations and the demo people, profiles and setups, without the analysed history. */
async function seedDemoLab(environment: Record<string, string>): Promise<void> {
  const config = loadConfig({ ...environment, BELLKEEP_DEMO: 'true' });
  const database = openDatabase(config.databaseUrl!);
  try {
    await bootstrapDatabase(database, config, { history: false });
  } finally {
    await database.close();
  }
}
