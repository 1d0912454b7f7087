import path from 'node:path';
import type { RunDto } from '@shared/api';
import type { DiskState, FullDiskReport } from '../support/full-disk-child';
import { runOnSmallDisk } from '../support/small-disk';

jest.setTimeout(120_000);

/** The tmpfs the harness gets: room for the app's own files and a few logs of 1.7 MB. */
const DISK_BYTES = 8 << 20;

const DROPPED = "The archive's disk is full: the log was not kept; free space in the server's data folder (BELLKEEP_DATA_DIR) and upload again.";
const KEPT = "The archive's disk is full: the bytes received so far are kept; free space in the server's data folder (BELLKEEP_DATA_DIR) and go on with the upload.";

/** The files of one folder of the data folder, by name (the harness lists the disk from its root). */
function filesIn(state: DiskState, folder: string): Record<string, number> {
  const prefix = `data/${folder}/`;
  return Object.fromEntries(
    Object.entries(state.files)
      .filter(([name]) => name.startsWith(prefix))
      .map(([name, bytes]) => [name.slice(prefix.length), bytes]),
  );
}

/** The file name of a resumable upload: the last part of its address. */
const uploadId = (location: string) => location.split('/').pop()!;

/**
 * The archive's disk full during an upload, on a real (small) file system: the harness runs the
 * app with its data folder on a tmpfs of its own and reports every answer and what the disk and
 * the database held after it.
 */
describe('uploads on a full disk', () => {
  let report: FullDiskReport;

  beforeAll(async () => {
    const printed = await runOnSmallDisk(path.join(__dirname, '..', 'support', 'full-disk-child.ts'), DISK_BYTES, 100_000);
    report = JSON.parse(printed.trim().split('\n').pop()!) as FullDiskReport;
  });

  it('refuses a multipart upload with 507 saying the log was not kept, leaving no partial file, no run and no archive record', () => {
    const { multipartOnFullDisk: step, before } = report;
    expect({ status: step.status, body: step.body }).toEqual({ status: 507, body: { error: { code: 'insufficient-storage', message: DROPPED } } });
    expect(filesIn(step, 'uploads')).toEqual({});
    expect(filesIn(step, 'archive')).toEqual({});
    expect([step.runs, step.archiveRecords]).toEqual([before.runs, before.archiveRecords]);
  });

  it('takes the same upload once space is freed', () => {
    const { multipartAfterFreeing: step, before, log } = report;
    expect(step.status).toBe(201);
    expect((step.body as RunDto).file).toMatchObject({ sha256: log.sha256, bytes: log.bytes });
    expect(filesIn(step, 'archive')).toEqual({ [`${log.sha256.slice(0, 2)}/${log.sha256}`]: log.bytes });
    expect(filesIn(step, 'uploads')).toEqual({});
    expect([step.runs, step.archiveRecords]).toEqual([before.runs + 1, before.archiveRecords + 1]);
  });

  it('answers a resumable PATCH with 507 saying what it kept, and keeps that much to go on from', () => {
    const { patchOnFullDisk: step, offsetOnFullDisk, before, log, resumableLocation } = report;
    expect({ status: step.status, body: step.body }).toEqual({ status: 507, body: { error: { code: 'insufficient-storage', message: KEPT } } });
    expect(offsetOnFullDisk.status).toBe(200);
    expect(offsetOnFullDisk.offset).toBeGreaterThan(0);
    expect(offsetOnFullDisk.offset).toBeLessThan(log.bytes);
    expect(filesIn(step, 'resumable-uploads')[uploadId(resumableLocation)]).toBe(offsetOnFullDisk.offset);
    expect(filesIn(step, 'uploads')).toEqual({});
    expect([step.runs, step.archiveRecords]).toEqual([before.runs, before.archiveRecords]);
  });

  it('goes on with that resumable upload once space is freed, to a run of the same archived log', () => {
    const { patchAfterFreeing: step, multipartAfterFreeing, log, resumableLocation } = report;
    expect(step.status).toBe(201);
    expect(step.body as RunDto).toMatchObject({ file: { sha256: log.sha256, bytes: log.bytes }, duplicateOf: (multipartAfterFreeing.body as RunDto).id });
    expect(filesIn(step, 'resumable-uploads')[uploadId(resumableLocation)]).toBeUndefined();
    expect(filesIn(step, 'uploads')).toEqual({});
    expect([step.runs, step.archiveRecords]).toEqual([multipartAfterFreeing.runs + 1, multipartAfterFreeing.archiveRecords]);
  });

  it('refuses a resumable upload that arrived whole but cannot be archived with 507, and drops it so the client starts again', () => {
    const { finishOnFullDisk: step, secondAfterFinishOnFullDisk, patchAfterFreeing, secondLocation } = report;
    expect({ status: step.status, body: step.body }).toEqual({ status: 507, body: { error: { code: 'insufficient-storage', message: DROPPED } } });
    expect(secondAfterFinishOnFullDisk.status).toBe(404);
    const leftOf = Object.keys(filesIn(step, 'resumable-uploads')).filter((name) => name.startsWith(uploadId(secondLocation)));
    expect(leftOf).toEqual([]);
    expect(filesIn(step, 'uploads')).toEqual({});
    expect(Object.keys(filesIn(step, 'archive'))).toHaveLength(1);
    expect([step.runs, step.archiveRecords]).toEqual([patchAfterFreeing.runs, patchAfterFreeing.archiveRecords]);
  });
});
