import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PROJECT_ROOT } from '@server/config/config';
import { freePort } from '../support/free-port';
import { createTestDatabase, type TestDatabase } from '../support/test-database';

jest.setTimeout(120_000);

describe('the compiled API (npm run api)', () => {
  let database: TestDatabase;
  let dataDir: string;
  beforeAll(async () => {
    database = await createTestDatabase();
    dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-compiled-api-'));
  });
  afterAll(async () => {
    await database.drop();
    fs.rmSync(dataDir, { recursive: true, force: true });
  });

  it('finds a database migrated from the TypeScript up to date, serves, and stops on SIGTERM', async () => {
    const port = await freePort();
    const child = spawn(process.execPath, [path.join(PROJECT_ROOT, 'server', 'cli', 'run-compiled.js'), 'server/api-main.ts'], {
      cwd: PROJECT_ROOT,
      env: {
        ...process.env,
        BELLKEEP_DATABASE_URL: database.url,
        BELLKEEP_SMTP_URL: 'smtp://127.0.0.1:9',
        BELLKEEP_PORT: String(port),
        BELLKEEP_DATA_DIR: dataDir,
        BELLKEEP_DEMO: 'false',
        BELLKEEP_LOG_LEVEL: 'silent',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let said = '';
    child.stdout.on('data', (chunk: Buffer) => (said += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (said += chunk.toString()));
    const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    const deadline = Date.now() + 90_000;
    while (!/Bellkeep API \d+ on/.test(said) && child.exitCode === null && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 100));
    try {
      // The compiled migrations keep their TypeScript names, so none runs again; with no admin yet,
      // the compiled seeders bring the demo lab's people (its admin) and setups.
      expect(said).toMatch(new RegExp(`Bellkeep API ${child.pid} on http://127\\.0\\.0\\.1:${port} \\(0 migration\\(s\\), 2 seeder\\(s\\)`));
      const [seeded] = await database.sequelize.query('SELECT name FROM "SequelizeData" ORDER BY name');
      expect((seeded as Array<{ name: string }>).map((row) => row.name)).toEqual(
        fs
          .readdirSync(path.join(PROJECT_ROOT, 'seeders'))
          .filter((name) => name.endsWith('.ts'))
          .sort(),
      );
      const ready = await fetch(`http://127.0.0.1:${port}/api/ready`);
      expect(ready.status).toBe(200);
      const health = await fetch(`http://127.0.0.1:${port}/api/health`);
      expect(await health.json()).toEqual({ status: 'ok' });
    } finally {
      child.kill('SIGTERM');
    }
    expect(await exited).toBe(0);
  });
});
