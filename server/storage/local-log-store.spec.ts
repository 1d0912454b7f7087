import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createLocalLogStore } from './local-log-store';
import { describeLogStoreContract, randomLog } from '@tests/support/log-store-contract';
import { putLog } from './log-store';

let dataDir: string;

describeLogStoreContract(
  'the local folder',
  () => {
    dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-local-store-'));
    const store = createLocalLogStore(dataDir);
    return Promise.resolve({
      store,
      config: { storage: { kind: 'local' as const }, dataDir },
      async tamper(sha256: string, bytes: Uint8Array) {
        await fs.promises.chmod(store.pathOf(sha256), 0o644);
        await fs.promises.writeFile(store.pathOf(sha256), bytes);
      },
    });
  },
  () => fs.promises.rm(dataDir, { recursive: true, force: true }),
);

describe('the local folder’s layout', () => {
  it('is the archive of earlier versions: archive/<first two hex digits>/<sha256>, read-only, and the engine reads that file itself', async () => {
    const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-local-layout-'));
    try {
      const store = createLocalLogStore(folder);
      const log = randomLog(4096);
      await putLog(store, log.source());
      const file = path.join(folder, 'archive', log.sha256.slice(0, 2), log.sha256);
      expect(fs.statSync(file).mode & 0o777).toBe(0o444);
      expect(await store.withLocalFile(log.sha256, path.join(folder, 'work'), (handed) => Promise.resolve(handed))).toBe(file);
      expect(fs.existsSync(path.join(folder, 'work'))).toBe(false);
    } finally {
      fs.rmSync(folder, { recursive: true, force: true });
    }
  });
});
