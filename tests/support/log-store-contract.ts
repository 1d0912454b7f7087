import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import type { Config } from '@server/config/config';
import { archiveContents } from './archive-contents';
import { putLog, StoredLogCorruptError, StoredLogMissingError, type LogStore } from '@server/storage/log-store';

/** A store under test, and what the contract needs around it. */
export interface StoreUnderTest {
  store: LogStore;
  /** The configuration that reaches the same archive (to look inside it). */
  config: Pick<Config, 'storage' | 'dataDir'>;
  /** Replaces a stored log's bytes behind the store's back. */
  tamper(sha256: string, bytes: Buffer): Promise<void>;
}

/** 12 MiB: more than one part of the S3 store's multipart upload. */
const LOG_BYTES = 12 * 1024 * 1024;

/** Random bytes, and a source that hands them out in 1 MiB chunks as an upload would. */
export function randomLog(size = LOG_BYTES): { bytes: Buffer; sha256: string; source: () => Readable } {
  const bytes = crypto.randomBytes(size);
  const chunks = () => Array.from({ length: Math.ceil(size / 2 ** 20) }, (_, index) => bytes.subarray(index * 2 ** 20, (index + 1) * 2 ** 20));
  return { bytes, sha256: crypto.createHash('sha256').update(bytes).digest('hex'), source: () => Readable.from(chunks()) };
}

async function readAll(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream as AsyncIterable<Buffer>) chunks.push(chunk);
  return Buffer.concat(chunks);
}

/** What every LogStore must do, run against one implementation. */
export function describeLogStoreContract(name: string, open: () => Promise<StoreUnderTest>, close: () => Promise<void>): void {
  describe(`${name}: the LogStore contract`, () => {
    let subject: StoreUnderTest;
    let workFolder: string;
    beforeAll(async () => {
      subject = await open();
      await subject.store.prepare();
      workFolder = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-work-'));
    }, 60_000);
    afterAll(async () => {
      fs.rmSync(workFolder, { recursive: true, force: true });
      await close();
    });
    const contents = () => archiveContents(subject.config);

    it('streams a log in under its SHA-256, reads it back checked, and hands a local file that is gone afterwards', async () => {
      const log = randomLog();
      const received = await subject.store.receive(log.source());
      expect({ sha256: received.sha256, bytes: received.bytes }).toEqual({ sha256: log.sha256, bytes: LOG_BYTES });
      expect((await contents()).kept).not.toContain(log.sha256);
      expect(await received.keep()).toEqual({ isNew: true });
      await received.drop();

      expect(await subject.store.stat(log.sha256)).toEqual({ bytes: LOG_BYTES });
      expect((await readAll(subject.store.read(log.sha256))).equals(log.bytes)).toBe(true);
      const digest = await subject.store.withLocalFile(log.sha256, workFolder, (file) => Promise.resolve(crypto.createHash('sha256').update(fs.readFileSync(file)).digest('hex')));
      expect(digest).toBe(log.sha256);
      expect(fs.readdirSync(workFolder)).toEqual([]);
      const { kept, leftovers } = await contents();
      expect(kept).toContain(log.sha256);
      expect(leftovers).toEqual([]);
    }, 60_000);

    it('keeps the same bytes once: the second time is no new log and leaves nothing behind', async () => {
      const log = randomLog();
      expect((await putLog(subject.store, log.source())).isNew).toBe(true);
      expect(await putLog(subject.store, log.source())).toEqual({ sha256: log.sha256, bytes: LOG_BYTES, isNew: false });
      const { kept, leftovers } = await contents();
      expect(kept.filter((sha256) => sha256 === log.sha256)).toHaveLength(1);
      expect(leftovers).toEqual([]);
    }, 60_000);

    it('a dropped log leaves nothing; a source that fails mid-way rejects with its error and leaves nothing', async () => {
      const before = (await contents()).kept;
      const dropped = randomLog();
      await (await subject.store.receive(dropped.source())).drop();

      const broken = randomLog();
      // More than one part, then a failure once the store holds some of it (a multipart upload under way).
      async function* breaksOff() {
        yield broken.bytes.subarray(0, 9 * 1024 * 1024);
        while ((await contents()).leftovers.length === 0) await new Promise((resolve) => setTimeout(resolve, 20));
        throw new Error('the client went away');
      }
      await expect(subject.store.receive(Readable.from(breaksOff()))).rejects.toThrow('the client went away');
      expect(await contents()).toEqual({ kept: before, leftovers: [] });
    }, 60_000);

    it('fails a read of changed bytes at the end, naming the log; a missing log is named missing; a bad name never reaches storage', async () => {
      const log = randomLog(64 * 1024);
      await putLog(subject.store, log.source());
      const changed = Buffer.from(log.bytes);
      changed[changed.length - 1] ^= 0xff;
      await subject.tamper(log.sha256, changed);
      const failure = await readAll(subject.store.read(log.sha256)).catch((error: unknown) => error);
      expect(failure).toBeInstanceOf(StoredLogCorruptError);
      expect((failure as StoredLogCorruptError).message).toContain(log.sha256);
      expect((failure as StoredLogCorruptError).foundSha256).toBe(crypto.createHash('sha256').update(changed).digest('hex'));

      await subject.store.discard(log.sha256);
      expect(await subject.store.stat(log.sha256)).toBeNull();
      await expect(readAll(subject.store.read(log.sha256))).rejects.toBeInstanceOf(StoredLogMissingError);
      await expect(subject.store.withLocalFile(log.sha256, workFolder, () => Promise.resolve('used'))).rejects.toBeInstanceOf(StoredLogMissingError);
      expect(fs.readdirSync(workFolder)).toEqual([]);

      expect(() => subject.store.read('../../secrets/signing-key.pem')).toThrow(/Not a SHA-256/);
      await expect(subject.store.stat('ABC')).rejects.toThrow(/Not a SHA-256/);
    }, 60_000);
  });
}
