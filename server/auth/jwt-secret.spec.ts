import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { resolveJwtSecret } from './jwt-secret';

describe('the token-signing secret', () => {
  let dataDir: string;
  beforeEach(() => {
    dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-secret-'));
  });
  afterEach(() => fs.rmSync(dataDir, { recursive: true, force: true }));

  it('takes the environment’s secret when given, writing nothing', () => {
    expect(resolveJwtSecret('x'.repeat(40), dataDir)).toBe('x'.repeat(40));
    expect(fs.readdirSync(dataDir)).toEqual([]);
  });

  it('otherwise generates one once, private to its owner, and keeps it across starts', () => {
    const first = resolveJwtSecret(undefined, dataDir);
    expect(first).toMatch(/^[A-Za-z0-9_-]{64}$/);
    expect(resolveJwtSecret(undefined, dataDir)).toBe(first);
    expect(fs.statSync(path.join(dataDir, 'secrets', 'jwt-secret')).mode & 0o777).toBe(0o600);
  });
});
