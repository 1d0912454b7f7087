import fs from 'node:fs';
import path from 'node:path';
import { ListMultipartUploadsCommand, ListObjectsV2Command } from '@aws-sdk/client-s3';
import type { Config } from '@server/config/config';
import { createLocalLogStore } from '@server/storage/local-log-store';
import { createS3LogStore } from '@server/storage/s3-log-store';

/** What an archive holds: the logs kept under their names, and anything else (which should be nothing once uploads settle). */
export interface ArchiveContents {
  /** SHA-256 of every kept log. */
  kept: string[];
  /** Received logs neither kept nor dropped, and (S3) multipart uploads neither completed nor aborted. */
  leftovers: string[];
}

/**
 * Looks inside the configured archive the way only a test may: the local folders, or the
 * bucket's objects and open multipart uploads.
 */
export async function archiveContents(config: Pick<Config, 'storage' | 'dataDir'>): Promise<ArchiveContents> {
  if (config.storage.kind === 'local') {
    const root = path.join(config.dataDir, 'archive');
    const kept = fs.existsSync(root) ? fs.readdirSync(root).flatMap((spread) => fs.readdirSync(path.join(root, spread))) : [];
    const receiving = createLocalLogStore(config.dataDir).receivingFolder;
    return { kept: kept.sort(), leftovers: fs.existsSync(receiving) ? fs.readdirSync(receiving) : [] };
  }
  const store = createS3LogStore(config.storage);
  const keys = ((await store.client.send(new ListObjectsV2Command({ Bucket: store.bucket }))).Contents ?? []).map((object) => object.Key!);
  const uploads = (await store.client.send(new ListMultipartUploadsCommand({ Bucket: store.bucket }))).Uploads ?? [];
  const isKept = (key: string) => key.startsWith('logs/');
  return {
    kept: keys
      .filter(isKept)
      .map((key) => key.split('/').pop()!)
      .sort(),
    leftovers: [...keys.filter((key) => !isKept(key)), ...uploads.map((upload) => `multipart upload of ${upload.Key}`)],
  };
}

/** The archive's contents once the uploads in flight have settled (no leftovers), or as they are after `timeoutMs`. */
export async function settledArchiveContents(config: Pick<Config, 'storage' | 'dataDir'>, timeoutMs = 10_000): Promise<ArchiveContents> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const contents = await archiveContents(config);
    if (contents.leftovers.length === 0 || Date.now() > deadline) return contents;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}
