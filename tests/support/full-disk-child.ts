import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Response } from 'supertest';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { modelLog } from './model-logs';
import { createResumableUpload, patchUpload, uploadOffset } from './resumable-api';
import { setupId, uploadLog } from './runs-api';
import { SMALL_DISK_VARIABLE } from './small-disk';
import { createTestApp } from './test-app';

/** Rounds of each log: about 1.7 MB, a fair share of the small disk. */
const LOG_ROUNDS = 120_000;

/** What the small disk and the database held at one moment. */
export interface DiskState {
  /** Every file on the small disk, by its path relative to the disk, with its size. */
  files: Record<string, number>;
  runs: number;
  archiveRecords: number;
}

/** One request's answer, and the state right after it. */
export interface DiskStep extends DiskState {
  status: number;
  body: unknown;
}

/** What the harness did on its small disk, in order, for full-disk.spec.ts to judge. */
export interface FullDiskReport {
  /** The log uploaded on a full disk and again after space was freed. */
  log: { sha256: string; bytes: number };
  /** The log whose resumable upload arrives whole but cannot be copied into the archive. */
  secondLog: { sha256: string; bytes: number };
  before: DiskState;
  multipartOnFullDisk: DiskStep;
  resumableLocation: string;
  patchOnFullDisk: DiskStep;
  offsetOnFullDisk: { status: number; offset: number | null };
  multipartAfterFreeing: DiskStep;
  patchAfterFreeing: DiskStep;
  secondLocation: string;
  finishOnFullDisk: DiskStep;
  secondAfterFinishOnFullDisk: { status: number; offset: number | null };
}

/** Every file under `folder`, by its path relative to it, with its size. */
function filesUnder(folder: string): Record<string, number> {
  const names = fs.readdirSync(folder, { recursive: true, encoding: 'utf8' });
  return Object.fromEntries(
    names
      .map((name) => [name, fs.statSync(path.join(folder, name))] as const)
      .filter(([, found]) => found.isFile())
      .map(([name, found]) => [name, found.size]),
  );
}

/** Fills the disk of `ballast` with it, leaving about `bytes` free (to the page); freed again by removing it. */
function leaveFree(ballast: string, bytes: number): void {
  fs.rmSync(ballast, { force: true });
  const { bavail, bsize } = fs.statfsSync(path.dirname(ballast));
  fs.writeFileSync(ballast, Buffer.alloc(Math.max(0, bavail * bsize - bytes)));
}

/** An answer's body as JSON, or its text when it is none (tus answers its errors without a JSON content type). */
function bodyOf(answer: Response): unknown {
  try {
    return JSON.parse(answer.text);
  } catch {
    return answer.text;
  }
}

const described = (bytes: Buffer) => ({ sha256: crypto.createHash('sha256').update(bytes).digest('hex'), bytes: bytes.length });

// Run by runOnSmallDisk (small-disk.ts) in a child process with a small tmpfs of its own: the real
// app in process with its data folder on that disk, uploads by multipart and by tus while the
// disk is full and after space is freed, and a JSON report of every answer and of what the disk
// and the database held after it, as the last line of standard output.
async function main(): Promise<void> {
  const disk = process.env[SMALL_DISK_VARIABLE]!;
  const ballast = path.join(disk, 'ballast');
  const testApp = await createTestApp({ BELLKEEP_DATA_DIR: path.join(disk, 'data') });
  try {
    const { app } = testApp;
    const token = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    const fenLink = await setupId(app, token, 'Fen link');
    const [log, secondLog] = [modelLog(LOG_ROUNDS, 1), modelLog(LOG_ROUNDS, 2)];
    const state = async (): Promise<DiskState> => ({
      files: filesUnder(disk),
      runs: await testApp.database.models.Run.count(),
      archiveRecords: await testApp.database.models.ArchiveFile.count(),
    });
    const step = async (answer: Response): Promise<DiskStep> => ({ status: answer.status, body: bodyOf(answer), ...(await state()) });
    const fields = { setupId: fenLink };
    const before = await state();

    leaveFree(ballast, log.bytes.length / 3);
    const multipartOnFullDisk = await step(await uploadLog(app, token, log, fields));
    const resumableLocation = await createResumableUpload(app, token, log.bytes.length, { ...fields, filename: log.name });
    const patchOnFullDisk = await step(await patchUpload(app, token, resumableLocation, 0, log.bytes));
    const offsetOnFullDisk = await uploadOffset(app, token, resumableLocation);

    fs.rmSync(ballast);
    const multipartAfterFreeing = await step(await uploadLog(app, token, log, fields));
    const goOnFrom = offsetOnFullDisk.offset ?? 0;
    const patchAfterFreeing = await step(await patchUpload(app, token, resumableLocation, goOnFrom, log.bytes.subarray(goOnFrom)));

    // Room for the whole upload, but not for its copy into the archive as well.
    const secondLocation = await createResumableUpload(app, token, secondLog.bytes.length, { ...fields, filename: secondLog.name });
    leaveFree(ballast, (secondLog.bytes.length * 4) / 3);
    const finishOnFullDisk = await step(await patchUpload(app, token, secondLocation, 0, secondLog.bytes));
    const secondAfterFinishOnFullDisk = await uploadOffset(app, token, secondLocation);

    const report: FullDiskReport = {
      log: described(log.bytes),
      secondLog: described(secondLog.bytes),
      before,
      multipartOnFullDisk,
      resumableLocation,
      patchOnFullDisk,
      offsetOnFullDisk,
      multipartAfterFreeing,
      patchAfterFreeing,
      secondLocation,
      finishOnFullDisk,
      secondAfterFinishOnFullDisk,
    };
    process.stdout.write(`${JSON.stringify(report)}\n`);
  } finally {
    await testApp.close();
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exitCode = 1;
});
