import crypto from 'node:crypto';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { analyseLog } from '@shared/analysis/node';
import type { AnalysisResult } from '@shared/analysis/result';
import { createAuditTrail } from '@server/audit/audit-trail';
import { loadConfig } from '@server/config/config';
import type { BootstrapReport } from '@server/database/bootstrap';
import { resolveSigningKey } from '@server/integrity/signing-key';
import { createSigningKeysService } from '@server/integrity/signing-keys.service';
import { createVerificationService } from '@server/integrity/verification.service';
import { createLocalLogStore } from '@server/storage/local-log-store';
import { DEMO_NIGHTS, REPLACED_NIGHT } from '@seeders/data/demo-nights';
import { bootstrapDatabase } from '@server/database/bootstrap';
import { DEMO_PEOPLE } from '@seeders/data/demo-people';
import { createTestDatabase, type TestDatabase } from '../support/test-database';
import { ROOT } from '../cli/run-analyse';

describe('start-up bootstrap of a database', () => {
  let database: TestDatabase;
  beforeEach(async () => {
    database = await createTestDatabase();
  });
  afterEach(() => database.drop());

  const emails = async () => (await database.models.User.findAll()).map((user) => user.email).sort();

  it('a real deployment: creates the admin named by the environment, once, and no demo people', async () => {
    const config = loadConfig({
      BELLKEEP_DEMO: 'false',
      BELLKEEP_ADMIN_EMAIL: 'Head.Of.Lab@kestrelfen.example',
      BELLKEEP_ADMIN_PASSWORD: 'a-long-admin-password',
      BELLKEEP_BCRYPT_ROUNDS: '4',
    });
    const report = await bootstrapDatabase(database, config);
    expect(report).toEqual({ migrations: [], seeders: [], createdAdmin: 'head.of.lab@kestrelfen.example' });
    expect(await emails()).toEqual(['head.of.lab@kestrelfen.example']);

    const again = await bootstrapDatabase(database, config);
    expect(again.createdAdmin).toBeUndefined();
    expect(await emails()).toEqual(['head.of.lab@kestrelfen.example']);
  });

  it('no admin and none configured: the demo lab’s people arrive, admin among them, once', async () => {
    const config = loadConfig({ BELLKEEP_DEMO: 'false', BELLKEEP_BCRYPT_ROUNDS: '4' });
    const report = await bootstrapDatabase(database, config);
    expect(report.seeders).toEqual(['20261201000000-demo-people.ts', '20261201010000-demo-profiles-and-setups.ts']);
    expect(await emails()).toEqual(DEMO_PEOPLE.map((person) => person.email).sort());
    expect((await bootstrapDatabase(database, config)).seeders).toEqual([]);
  });
});

describe('the demo lab’s history of nights', () => {
  it('is analysed by the engine, archived like an upload, and reproducible from its archived file and seed', async () => {
    const database = await createTestDatabase();
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-history-'));
    try {
      const bootstrap = spawnSync(path.join(ROOT, 'node_modules/.bin/tsx'), [path.join(ROOT, 'tests/support/bootstrap-child.ts')], {
        cwd: ROOT,
        encoding: 'utf8',
        env: { ...process.env, BELLKEEP_DATABASE_URL: database.url, BELLKEEP_DATA_DIR: dataDir, BELLKEEP_BCRYPT_ROUNDS: '4' },
      });
      expect({ status: bootstrap.status, stderr: bootstrap.stderr }).toMatchObject({ status: 0 });
      const report = JSON.parse(bootstrap.stdout) as BootstrapReport;
      expect(report.seeders).toContain('20261201020000-demo-nights.ts');

      const runs = await database.models.Run.findAll({ order: [['id', 'ASC']] });
      // One run per night and setup, and the replaced night's first attempt.
      expect(runs).toHaveLength(2 * DEMO_NIGHTS + 1);
      const bookings = await database.models.Booking.findAll();
      expect(bookings).toHaveLength(2 * DEMO_NIGHTS - 1);
      expect(runs.filter((run) => run.bookingId === null).map((run) => run.originalName)).toEqual([expect.stringMatching(/^mill-lane-bench-/)]);
      const replacement = runs.find((run) => run.attempt === 2)!;
      expect(replacement.replacementReason).toBe(REPLACED_NIGHT.reason);
      expect(runs.find((run) => run.bookingId === replacement.bookingId && run.attempt === 1)).toBeDefined();
      // Every booked run carries its booking's seed, and the booking published its hash beforehand.
      for (const run of runs.filter((candidate) => candidate.bookingId !== null)) {
        const booking = bookings.find((candidate) => candidate.id === run.bookingId)!;
        expect(run.seed).toBe(booking.seed);
        expect(crypto.createHash('sha256').update(booking.seed).digest('hex')).toBe(booking.seedCommitment);
        expect(booking.createdAt.getTime()).toBeLessThan(booking.windowStart.getTime());
      }
      const verdicts = new Set(runs.map((run) => run.verdict));
      expect(verdicts).toEqual(new Set(['ACCEPT', 'ABORT']));
      expect(runs.some((run) => (run.result as unknown as AnalysisResult).key!.finiteKeyBits > 0)).toBe(true);

      const sample = runs[3];
      const stored = sample.result as unknown as AnalysisResult;
      const again = await analyseLog({ path: createLocalLogStore(dataDir).pathOf(sample.fileSha256) }, { profile: stored.profile, seed: sample.seed });
      expect(again.fingerprint).toBe(stored.fingerprint);
      expect(await database.models.SignOff.count()).toBe(2 * (DEMO_NIGHTS - 2));

      // Signed like any stored result, with the key the bootstrap listed: every check holds.
      const signingKeys = createSigningKeysService(database.sequelize, database.models, createAuditTrail(database.models.AuditEvent), resolveSigningKey(undefined, dataDir));
      const checked = await createVerificationService(database.models, createLocalLogStore(dataDir), signingKeys).verify(sample.id);
      expect(checked.checks.map((check) => [check.check, check.passed])).toEqual([
        ['result-fingerprint', true],
        ['signature', true],
        ['archive-file', true],
        ['system-trail', true],
      ]);
      expect(runs.every((run) => run.signingKeyId === signingKeys.current.keyId)).toBe(true);
    } finally {
      await database.drop();
      fs.rmSync(dataDir, { recursive: true, force: true });
    }
  }, 300_000);
});

describe('configuration', () => {
  it('names the bad variable', () => {
    expect(() => loadConfig({ BELLKEEP_PORT: 'eighty' })).toThrow(/BELLKEEP_PORT/);
    expect(() => loadConfig({ BELLKEEP_JWT_SECRET: 'short' })).toThrow(/BELLKEEP_JWT_SECRET: must be at least 32/);
    expect(() => loadConfig({ BELLKEEP_ADMIN_EMAIL: 'a@kestrelfen.example' })).toThrow(/both BELLKEEP_ADMIN_EMAIL and BELLKEEP_ADMIN_PASSWORD/);
    expect(() => loadConfig({ BELLKEEP_STORAGE: 'disk' })).toThrow(/BELLKEEP_STORAGE: must be local or s3/);
    expect(() => loadConfig({ BELLKEEP_STORAGE: 's3', BELLKEEP_S3_ENDPOINT: 'not a url' })).toThrow(/BELLKEEP_S3_ENDPOINT: must be a URL/);
    expect(() => loadConfig({ BELLKEEP_S3_BUCKET: 'Logs_Of_Kestrel' })).toThrow(/BELLKEEP_S3_BUCKET: must be an S3 bucket name/);
    expect(() => loadConfig({ AWS_ACCESS_KEY_ID: 'only-the-id' })).toThrow(/both AWS_ACCESS_KEY_ID and AWS_SECRET_ACCESS_KEY/);
  });
});
