import crypto from 'node:crypto';
import { pipeline, type Readable } from 'node:stream';
import { CreateBucketCommand, DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, HeadObjectCommand, type S3Client } from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import type { S3StorageConfig } from '../config/config';
import { checkedSha256 } from './content-address';
import { DigestStream } from './digest-stream';
import { StoredLogCorruptError, StoredLogMissingError, type LogStore, type ReceivedLog } from './log-store';
import { createS3Client, isNotFound } from './s3-client';
import { copyWithin, S3_COPY_LIMITS, type CopyLimits } from './s3-copy';
import { withWorkingCopy } from './working-copy';

/**
 * Parts of a streamed upload: S3's smallest part size, 2 in flight. Measured with lib-storage
 * (`npm run bench:pipeline`): 8 MiB × 4 held 150 MB of buffers, 5 MiB × 2 86 MB, and was not slower
 * against the local fake. 10 000 parts reach 48 GiB, beyond the upload limit.
 */
const UPLOAD_PART_BYTES = 5 * 1024 ** 2;
const UPLOADS_IN_FLIGHT = 2;

/** Object metadata naming the content's SHA-256 (sent as `x-amz-meta-sha256`). */
const SHA256_METADATA = 'sha256';

/** The S3 store, with its key layout (tests look objects up by key). */
export interface S3LogStore extends LogStore {
  readonly client: S3Client;
  readonly bucket: string;
  /** `logs/ab/<sha256>`: the key of a stored log. */
  keyOf(sha256: string): string;
}

/**
 * The archive in an S3-compatible bucket: each log under `logs/<first two hex digits>/<sha256>`
 * with its hash as metadata. A log streams in by multipart upload to `incoming/<uuid>` while it
 * is hashed, and is copied server-side to its content key when kept.
 */
export function createS3LogStore(config: S3StorageConfig, copyLimits: CopyLimits = S3_COPY_LIMITS): S3LogStore {
  if (!config.endpoint) {
    throw new Error('Set BELLKEEP_S3_ENDPOINT for BELLKEEP_STORAGE=s3 (only `npm start` runs a local fake S3 server when it is unset).');
  }
  const client = createS3Client({ ...config, endpoint: config.endpoint });
  const { bucket } = config;
  const keyOf = (sha256: string) => `logs/${checkedSha256(sha256).slice(0, 2)}/${sha256}`;
  const named = (key: string) => `s3://${bucket}/${key}`;

  /** An SDK failure as a sentence naming the operation, the object and the server. */
  const failure = (operation: string, key: string | null, error: unknown) =>
    new Error(`S3 ${operation} of ${key ? named(key) : `bucket ${bucket}`} at ${config.endpoint} failed: ${(error as Error).name}: ${(error as Error).message}`, { cause: error });

  let ready: Promise<void> | undefined;
  function prepare(): Promise<void> {
    ready ??= ensureBucket().catch((error: unknown) => {
      ready = undefined;
      throw error;
    });
    return ready;
  }

  async function bucketExists(): Promise<boolean> {
    try {
      await client.send(new HeadBucketCommand({ Bucket: bucket }));
      return true;
    } catch (error) {
      if (isNotFound(error)) return false;
      throw failure('HeadBucket', null, error);
    }
  }

  async function ensureBucket(): Promise<void> {
    if (await bucketExists()) return;
    try {
      await client.send(new CreateBucketCommand({ Bucket: bucket }));
    } catch (error) {
      // Another process may have created it meanwhile ("already owned by you"): fine if it is there now.
      if (!(await bucketExists())) throw failure('CreateBucket', null, error);
    }
  }

  /** The object's size, or null when there is none. */
  async function sizeOf(key: string): Promise<{ bytes: number } | null> {
    try {
      const head = await client.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
      return { bytes: head.ContentLength ?? 0 };
    } catch (error) {
      if (isNotFound(error)) return null;
      throw failure('HeadObject', key, error);
    }
  }

  async function remove(key: string): Promise<void> {
    try {
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    } catch (error) {
      throw failure('DeleteObject', key, error);
    }
  }

  async function receive(source: Readable): Promise<ReceivedLog> {
    await prepare();
    const waitingKey = `incoming/${crypto.randomUUID()}`;
    const digest = new DigestStream();
    // A failing source destroys the digest with its error, which fails the upload: lib-storage
    // then aborts the multipart upload (so no parts are left) before `done()` rejects.
    pipeline(source, digest, () => undefined);
    const upload = new Upload({ client, params: { Bucket: bucket, Key: waitingKey, Body: digest }, partSize: UPLOAD_PART_BYTES, queueSize: UPLOADS_IN_FLIGHT });
    try {
      await upload.done();
    } catch (error) {
      // A small log goes up in one PutObject; make sure none of it stays either.
      await remove(waitingKey).catch(() => undefined);
      throw source.errored ?? digest.errored ?? failure('upload', waitingKey, error);
    }
    const { sha256, bytes } = digest;
    let waiting = true;
    const dropWaiting = async () => {
      if (!waiting) return;
      await remove(waitingKey);
      waiting = false;
    };
    return {
      sha256,
      bytes,
      async keep() {
        const target = keyOf(sha256);
        const isNew = (await sizeOf(target)) === null;
        if (isNew) {
          try {
            await copyWithin(client, bucket, { from: waitingKey, to: target, bytes, metadata: { [SHA256_METADATA]: sha256 } }, copyLimits);
          } catch (error) {
            throw failure('copy', target, error);
          }
        }
        // The log is kept now: failing to remove the temporary object must not undo that. A
        // leftover under incoming/ is garbage (the bucket's lifecycle rule expires it).
        await remove(waitingKey).catch(() => undefined);
        waiting = false;
        return { isNew };
      },
      drop: dropWaiting,
    };
  }

  function read(sha256: string): Readable {
    const key = keyOf(sha256);
    const verified = new DigestStream({ sha256, location: named(key) });
    client
      .send(new GetObjectCommand({ Bucket: bucket, Key: key }))
      .then((object) => {
        const recorded = object.Metadata?.[SHA256_METADATA];
        if (recorded !== sha256) {
          (object.Body as Readable).destroy();
          throw new StoredLogCorruptError(named(key), `its ${SHA256_METADATA} metadata is ${recorded ?? 'missing'}, not its name ${sha256}`);
        }
        pipeline(object.Body as Readable, verified, () => undefined);
      })
      .catch((error: unknown) => {
        const problem = error instanceof StoredLogCorruptError ? error : isNotFound(error) ? new StoredLogMissingError(named(key)) : failure('GetObject', key, error);
        verified.destroy(problem);
      });
    return verified;
  }

  return {
    client,
    bucket,
    keyOf,
    prepare,
    receive,
    read,

    stat: async (sha256) => sizeOf(keyOf(sha256)),

    withLocalFile: (sha256, workFolder, use) => withWorkingCopy(() => read(sha256), workFolder, use),

    discard: async (sha256) => remove(keyOf(sha256)),
  };
}
