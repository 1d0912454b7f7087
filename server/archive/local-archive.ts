import fs from 'node:fs';
import path from 'node:path';

const SHA256_HEX = /^[0-9a-f]{64}$/;

export interface LocalArchive {
  /** Where uploads stream to before they are archived. */
  temporaryFolder: string;
  /**
   * Moves a hashed temporary file into the archive under its content address, read-only.
   * Returns whether the bytes were new (false: the same content was archived before).
   */
  store(temporaryFile: string, sha256: string): Promise<boolean>;
  /** Path of an archived file, from its SHA-256 only (never from anything a user named). */
  pathOf(sha256: string): string;
  /** Removes an archived file no database row refers to (cleanup after a failed transaction). */
  discard(sha256: string): Promise<void>;
}

/**
 * The content-addressed archive on local disk: `archive/ab/abcdef…` (the first two hex digits
 * spread files over folders), files mode 0444.
 */
export function createLocalArchive(dataDir: string): LocalArchive {
  const root = path.join(dataDir, 'archive');
  const temporaryFolder = path.join(dataDir, 'uploads');

  const pathOf = (sha256: string) => {
    if (!SHA256_HEX.test(sha256)) throw new Error(`Not a SHA-256 in hex: ${sha256}`);
    return path.join(root, sha256.slice(0, 2), sha256);
  };

  return {
    temporaryFolder,
    pathOf,

    async store(temporaryFile, sha256) {
      const target = pathOf(sha256);
      await fs.promises.mkdir(path.dirname(target), { recursive: true });
      if (fs.existsSync(target)) {
        await fs.promises.rm(temporaryFile, { force: true });
        return false;
      }
      await fs.promises.chmod(temporaryFile, 0o444);
      await fs.promises.rename(temporaryFile, target);
      return true;
    },

    async discard(sha256) {
      await fs.promises.rm(pathOf(sha256), { force: true });
    },
  };
}
