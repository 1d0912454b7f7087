import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { HostileLog } from '@fixtures/hostile/hostile-log';
import { hostileLogs } from '@fixtures/hostile/hostile-logs';
import { HOSTILE_NAMES } from '@fixtures/hostile/hostile-names';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { PROJECT_ROOT } from '@server/config/config';
import type { ApiErrorBody, RunDto } from '@shared/api';
import { settledArchiveContents } from '../support/archive-contents';
import { atMostAtOnce } from '../support/at-most-at-once';
import { setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

/** Small enough that one log of the set is over it, large enough for the 10 MB lines. */
const UPLOAD_LIMIT_BYTES = 12 * 1024 * 1024;
/** Uploads in flight at once, as a few busy stations would send them. */
const UPLOADS_AT_ONCE = 8;
/**
 * Analysing workers in this process: each takes a job at most every polling interval (0.5 s in
 * test apps), so one would need minutes for a thousand small logs.
 */
const WORKERS = 8;

/** What became of one upload: the answer, and the finished run when there is one. */
interface Outcome {
  log: HostileLog;
  status: number;
  body: unknown;
  run?: RunDto;
}

/** Every file under `folder`, relative to it (empty when it does not exist). */
function filesUnder(folder: string): string[] {
  if (!fs.existsSync(folder)) return [];
  return fs.readdirSync(folder, { recursive: true, encoding: 'utf8' }).filter((name) => fs.statSync(path.join(folder, name)).isFile());
}

/** Size and modification time of a path, or null where there is nothing. */
function fingerprintOf(target: string): string | null {
  try {
    const found = fs.lstatSync(target);
    return `${found.size}@${found.mtimeMs}`;
  } catch {
    return null;
  }
}

/** What is wrong with an outcome, against what its log expects; null when nothing is. */
function problemWith({ log: { expected }, status, body, run }: Outcome): string | null {
  if (expected.kind === 'refused') {
    const error = (body as ApiErrorBody).error;
    const refused = status === expected.status && error?.field === expected.field && expected.message.test(error.message);
    return refused ? null : `expected ${expected.status} on "${expected.field}" saying ${expected.message}`;
  }
  if (!run) return 'expected a run';
  const result = run.result;
  if (expected.kind === 'verdict') {
    return run.state !== 'invalid' && run.verdict !== null && result?.errors.length === 0 ? null : 'expected a verdict';
  }
  const first = result?.errors[0];
  const named =
    run.state === 'invalid' &&
    first !== undefined &&
    Number.isInteger(first.line) &&
    first.line >= 1 &&
    (expected.line === null || first.line === expected.line) &&
    first.column === expected.column &&
    (expected.value === undefined || first.value === expected.value) &&
    expected.message.test(first.message);
  return named ? null : `expected INVALID at line ${expected.line ?? 'any'}, column ${expected.column}, saying ${expected.message}`;
}

/** An outcome's problem as one line naming the log and what came back, or null. */
function mismatch(outcome: Outcome): string | null {
  const problem = problemWith(outcome);
  if (problem === null) return null;
  const { log, status, body, run } = outcome;
  const seen = run ? `run ${run.id} ${run.state}: ${JSON.stringify(run.result?.errors[0] ?? run.error)}` : `${status} ${JSON.stringify(body)}`;
  return `#${log.id} ${log.category} (${JSON.stringify(log.fileName.slice(0, 40))}): ${problem}; got ${seen.slice(0, 300)}`;
}

describe('hostile logs through the API', () => {
  let sandbox: string;
  let testApp: TestApp;
  let token: string;
  const logs = hostileLogs({ uploadLimitBytes: UPLOAD_LIMIT_BYTES });
  const outcomes: Outcome[] = [];
  const serverErrors: string[] = [];
  let filesBefore: Set<string>;
  /** Where a hostile name would land if joined to a folder the server writes in, as it was before. */
  const targetsBefore = new Map<string, string | null>();

  // About two minutes on a quiet machine; more while other suites run beside it.
  beforeAll(async () => {
    // The data folder inside a folder of its own: anything written beside it would show there.
    sandbox = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-hostile-'));
    const dataDir = path.join(sandbox, 'data');
    testApp = await createTestApp({ BELLKEEP_DATA_DIR: dataDir, BELLKEEP_UPLOAD_LIMIT_BYTES: String(UPLOAD_LIMIT_BYTES) });
    for (let worker = 0; worker < WORKERS; worker++) await testApp.startWorker();
    token = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    const fenLink = await setupId(testApp.app, token, 'Fen link');

    filesBefore = new Set(filesUnder(sandbox));
    const folders = [dataDir, path.join(dataDir, 'uploads'), path.join(dataDir, 'archive', '00'), testApp.config.workDir, PROJECT_ROOT, process.cwd()];
    for (const folder of folders)
      for (const name of HOSTILE_NAMES) {
        const target = path.resolve(folder, name);
        targetsBefore.set(target, fingerprintOf(target));
      }

    await atMostAtOnce(logs, UPLOADS_AT_ONCE, async (log) => {
      const response = await uploadLog(testApp.app, token, { bytes: log.bytes, name: log.fileName }, { setupId: fenLink });
      if (response.status >= 500) serverErrors.push(`upload #${log.id} ${log.category}: ${response.status} ${response.text}`);
      outcomes.push({ log, status: response.status, body: response.body });
    });
    await atMostAtOnce(
      outcomes.filter((outcome) => outcome.status === 201),
      UPLOADS_AT_ONCE,
      async (outcome) => {
        // Answers anything but 200 with an error: a server error on reading a run shows here.
        outcome.run = await waitForFinishedRun(testApp.app, token, (outcome.body as RunDto).id, 150_000);
      },
    );
  }, 480_000);

  afterAll(async () => {
    await testApp?.close();
    if (sandbox) fs.rmSync(sandbox, { recursive: true, force: true });
  });

  it('sends every one of more than a thousand logs', () => {
    expect(outcomes).toHaveLength(logs.length);
    expect(logs.length).toBeGreaterThanOrEqual(1000);
  });

  it('answers no upload with a server error', () => {
    expect(serverErrors).toEqual([]);
  });

  it('refuses an upload with a 4xx naming the problem, or makes a run that ends', () => {
    for (const { status, body, run } of outcomes) {
      if (status === 201) expect(run?.finishedAt).toEqual(expect.any(String));
      else {
        expect(status).toBeGreaterThanOrEqual(400);
        expect(status).toBeLessThan(500);
        expect((body as ApiErrorBody).error.message.length).toBeGreaterThan(10);
      }
    }
  });

  it('ends every broken log INVALID, its first problem at the line and field where it was broken; odd but valid logs get a verdict', () => {
    expect(outcomes.map(mismatch).filter((problem) => problem !== null)).toEqual([]);
  });

  it('keeps the first 255 characters of a file name, and no folder of it', () => {
    // Characters as PostgreSQL counts them: code points, not UTF-16 units.
    const first255 = (name: string) => [...name].slice(0, 255).join('');
    for (const { log, run } of outcomes) {
      if (!run) continue;
      expect([...run.file.originalName].length).toBeLessThanOrEqual(255);
      expect(run.file.originalName).not.toMatch(/[/\\]/);
      if (!/[/\\]/.test(log.fileName)) expect(run.file.originalName).toBe(first255(log.fileName));
    }
  });

  it('writes nothing outside its data folder, and keeps only content-addressed names in the archive', async () => {
    const { kept, leftovers } = await settledArchiveContents(testApp.config);
    expect(leftovers).toEqual([]);
    const uploaded = new Set(outcomes.flatMap(({ run }) => (run ? [run.file.sha256] : [])));
    expect(new Set(kept)).toEqual(uploaded);

    const written = filesUnder(sandbox).filter((file) => !filesBefore.has(file));
    const archived = written.filter((file) => /^data\/archive\/([0-9a-f]{2})\/\1[0-9a-f]{62}$/.test(file));
    const mail = written.filter((file) => file.startsWith('data/mail/'));
    expect(written.filter((file) => !archived.includes(file) && !mail.includes(file))).toEqual([]);
    expect(archived).toHaveLength(uploaded.size);
    expect(filesUnder(testApp.config.workDir)).toEqual([]);

    for (const [target, before] of targetsBefore) expect([target, fingerprintOf(target)]).toEqual([target, before]);
  });

  it('still answers its health check', async () => {
    await request(testApp.app).get('/api/health').expect(200);
  });
});
