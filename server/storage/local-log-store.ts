import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { bufferedFileStream } from './buffered-file-stream';
import { checkedSha256 } from './content-address';
import { DigestStream } from './digest-stream';
import { StoredLogMissingError, type LogStore, type ReceivedLog } from './log-store';

/** The local store, with what only it has: the path of each archived file. */
export interface LocalLogStore extends LogStore {
  /** Path of an archived file, from its SHA-256 only. */
  pathOf(sha256: string): string;
  /** Where received logs wait, as `upload-<uuid>.part`, until they are kept or dropped. */
  readonly receivingFolder: string;
}

/**
 * The archive as a content-addressed folder on local disk, the embedded default for one machine:
 * `<dataDir>/archive/ab/abcdef…` (the first two hex digits spread files over folders), files
 * mode 0444. Received logs wait in `<dataDir>/uploads/` under names of their own.
 */
export function createLocalLogStore(dataDir: string): LocalLogStore {
  const root = path.join(dataDir, 'archive');
  const receivingFolder = path.join(dataDir, 'uploads');
  const pathOf = (sha256: string) => path.join(root, checkedSha256(sha256).slice(0, 2), sha256);
  const missingAsNull = (error: NodeJS.ErrnoException) => {
    if (error.code === 'ENOENT') return null;
    throw error;
  };

  async function receive(source: Readable): Promise<ReceivedLog> {
    await fs.promises.mkdir(receivingFolder, { recursive: true });
    const waiting = path.join(receivingFolder, `upload-${crypto.randomUUID()}.part`);
    const digest = new DigestStream();
    try {
      await pipeline(source, digest, bufferedFileStream(waiting, { flags: 'wx', mode: 0o600 }));
    } catch (error) {
      await fs.promises.rm(waiting, { force: true });
      throw error;
    }
    const { sha256, bytes } = digest;
    return {
      sha256,
      bytes,
      async keep() {
        const target = pathOf(sha256);
        await fs.promises.mkdir(path.dirname(target), { recursive: true });
        if (fs.existsSync(target)) {
          await fs.promises.rm(waiting, { force: true });
          return { isNew: false };
        }
        await fs.promises.chmod(waiting, 0o444);
        await fs.promises.rename(waiting, target);
        return { isNew: true };
      },
      // After keep() the file has moved away, so this finds nothing to remove.
      drop: () => fs.promises.rm(waiting, { force: true }),
    };
  }

  return {
    pathOf,
    receivingFolder,
    prepare: async () => {
      await fs.promises.mkdir(root, { recursive: true });
    },
    receive,

    read(sha256) {
      const file = pathOf(sha256);
      const verified = new DigestStream({ sha256, location: file });
      const bytes = fs.createReadStream(file);
      bytes.once('error', (error: NodeJS.ErrnoException) => verified.destroy(error.code === 'ENOENT' ? new StoredLogMissingError(file) : error));
      return bytes.pipe(verified);
    },

    async stat(sha256) {
      const found = await fs.promises.stat(pathOf(sha256)).catch(missingAsNull);
      return found && { bytes: found.size };
    },

    async withLocalFile(sha256, _workFolder, use) {
      const file = pathOf(sha256);
      if (!fs.existsSync(file)) throw new StoredLogMissingError(file);
      return use(file);
    },

    async discard(sha256) {
      await fs.promises.rm(pathOf(sha256), { force: true });
    },
  };
}
