import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Client } from 'pg';
import { freePort } from '@tests/support/free-port';
import { startPostgresCluster } from './postgres-cluster';

async function query(url: string, sql: string): Promise<Array<Record<string, unknown>>> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query<Record<string, unknown>>(sql)).rows;
  } finally {
    await client.end();
  }
}

describe('the project’s own PostgreSQL cluster', () => {
  let folder: string;
  let port: number;
  beforeAll(async () => {
    folder = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-cluster-spec-'));
    fs.chmodSync(folder, 0o755);
    port = await freePort();
  });
  afterAll(() => fs.rmSync(folder, { recursive: true, force: true }));

  it('initialises, listens on loopback only, is reused while running, keeps its data across restarts and recovers a stale pid file', async () => {
    const options = { folder, port, database: 'bellkeep_spec' };
    const first = await startPostgresCluster(options);
    expect(first.startedHere).toBe(true);
    expect(first.url).toMatch(new RegExp(`^postgres://bellkeep:[^@]+@127\\.0\\.0\\.1:${port}/bellkeep_spec$`));
    expect(await query(first.url, 'SHOW listen_addresses')).toEqual([{ listen_addresses: '127.0.0.1' }]);
    await query(first.url, 'CREATE TABLE kept (night text)');

    const second = await startPostgresCluster(options);
    expect(second.startedHere).toBe(false);
    expect(second.url).toBe(first.url);

    first.stop();
    // An unclean stop: a pid file left behind naming a live process that is not PostgreSQL.
    const pidFile = path.join(folder, 'cluster', 'postmaster.pid');
    fs.writeFileSync(pidFile, `${process.pid}\n${path.join(folder, 'cluster')}\n`);
    const third = await startPostgresCluster(options);
    try {
      expect(third.startedHere).toBe(true);
      expect(await query(third.url, "SELECT to_regclass('kept') IS NOT NULL AS present")).toEqual([{ present: true }]);
    } finally {
      third.stop();
    }
  });
});
