import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { bufferedFileStream } from './buffered-file-stream';

/** Copies are named `log-copy-<uuid>.part`: only such files are ever removed from a work folder. */
const COPY_NAME = /^log-copy-[0-9a-f-]{36}\.part$/;

/**
 * Writes the bytes of `open()` to a file of a generated name in `workFolder`, runs `use` on it once
 * every byte is written (and, for a verified source, checked), and deletes it when `use` settles.
 */
export async function withWorkingCopy<T>(open: () => Readable, workFolder: string, use: (file: string) => Promise<T>): Promise<T> {
  await fs.promises.mkdir(workFolder, { recursive: true });
  const copy = path.join(workFolder, `log-copy-${crypto.randomUUID()}.part`);
  try {
    await pipeline(open(), bufferedFileStream(copy, { flags: 'wx', mode: 0o600 }));
    return await use(copy);
  } finally {
    await fs.promises.rm(copy, { force: true });
  }
}

/**
 * Removes the copies a worker killed mid-analysis left in its work folder (a worker calls this on
 * start; each worker has a folder of its own). Other files are left alone. Returns how many went.
 */
export async function removeLeftoverCopies(workFolder: string): Promise<number> {
  const names = await fs.promises.readdir(workFolder).catch((error: NodeJS.ErrnoException) => {
    if (error.code === 'ENOENT') return [];
    throw error;
  });
  const leftovers = names.filter((name) => COPY_NAME.test(name));
  await Promise.all(leftovers.map((name) => fs.promises.rm(path.join(workFolder, name), { force: true })));
  return leftovers.length;
}
