import request from 'supertest';
import { FINISHED_STATES, type RunDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { VERDICT_MAIL_QUEUE } from '@server/queue/analysis-queue';
import { settledArchiveContents } from '../support/archive-contents';
import { modelLog } from '../support/model-logs';
import { inbox, setupId, uploadLog, type CaughtMail } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(120_000);

/** Uploads sent at the same moment, half by each of two experimentalists. */
const UPLOADS = 50;
/**
 * Workers in this process, sharing its pool of 10 database connections: ten verdict mails at once
 * once took every connection and waited for one more, forever.
 */
const WORKERS = 10;
/** Rounds per log: small, so the load is the uploads, jobs and mails rather than the engine. */
const ROUNDS = 4000;

/** Polls `done` until it holds, failing after `timeoutMs` with `what`. */
async function until(what: string, done: () => Promise<boolean>, timeoutMs = 90_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await done())) {
    if (Date.now() > deadline) throw new Error(`Not within ${timeoutMs} ms: ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

/**
 * Fifty uploads at once from two accounts, each log with bytes of its own, analysed by ten
 * workers in one process: every upload is a run, every run a verdict and exactly one verdict mail,
 * and the archive holds exactly the uploaded logs, each with its record.
 */
describe('fifty simultaneous uploads from two experimentalists', () => {
  let testApp: TestApp;
  let answers: request.Response[];
  let runs: RunDto[];
  let mails: CaughtMail[];

  beforeAll(async () => {
    testApp = await createTestApp();
    for (let worker = 0; worker < WORKERS; worker++) await testApp.startWorker();
    const uploaders = [await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD), await testApp.signIn('ada.reyes@kestrelfen.example', DEMO_PASSWORD)];
    const fenLink = await setupId(testApp.app, uploaders[0], 'Fen link');
    const logs = Array.from({ length: UPLOADS }, (_, upload) => modelLog(ROUNDS, upload + 1));

    answers = await Promise.all(logs.map((log, upload) => uploadLog(testApp.app, uploaders[upload % 2], log, { setupId: fenLink })));
    const ids = answers.filter((answer) => answer.status === 201).map((answer) => (answer.body as RunDto).id);

    const { models } = testApp.database;
    await until('every run finished, its mail job done', async () => {
      const finished = await models.Run.count({ where: { id: ids, state: FINISHED_STATES as string[] } });
      return finished === ids.length && (await testApp.queue.boss.getQueueSize(VERDICT_MAIL_QUEUE, { before: 'completed' })) === 0;
    });
    await until('the mail catcher holds a mail per run', async () => (await inbox(testApp.mailCatcher.inboxUrl)).length >= ids.length, 10_000);
    mails = await inbox(testApp.mailCatcher.inboxUrl);
    runs = [];
    for (const id of ids) runs.push((await request(testApp.app).get(`/api/runs/${id}`).set('Authorization', `Bearer ${uploaders[0]}`).expect(200)).body as RunDto);
  });
  afterAll(() => testApp?.close());

  it('makes a run of every upload, from both accounts, none a duplicate', () => {
    expect(answers.map((answer) => answer.status)).toEqual(answers.map(() => 201));
    expect(new Set(runs.map((run) => run.file.sha256)).size).toBe(UPLOADS);
    expect(runs.filter((run) => run.duplicateOf !== null)).toEqual([]);
    const byUploader = (name: string) => runs.filter((run) => run.uploadedBy === name).length;
    expect([byUploader('Dev Okafor'), byUploader('Ada Reyes')]).toEqual([UPLOADS / 2, UPLOADS / 2]);
  });

  it('gives every run a verdict and exactly one sent verdict mail', () => {
    const judged = (run: RunDto) => /^(accepted|aborted)$/.test(run.state) && /^(ACCEPT|ABORT)$/.test(run.verdict ?? '');
    expect(runs.filter((run) => !judged(run)).map(({ id, state, verdict }) => ({ id, state, verdict }))).toEqual([]);
    for (const run of runs) expect(run.deliveries.map((delivery) => delivery.status)).toEqual(['sent']);
  });

  it('leaves exactly one mail per run in the catcher, and one more for a run its uploader may not sign, none twice', () => {
    // Each mail carries a Message-ID of its own: a mail sent twice would show as a repeated line. Ada
    // Reyes leads Fen link's shifts too: under the four-eyes rule her own runs' mail to her has no sign-off link.
    const expected = runs.flatMap((run) => [
      `<run-${run.id}-verdict@bellkeep> Run ${run.id} of Fen link (unbooked) is analysed: ${run.verdict}; it awaits sign-off`,
      ...(run.uploadedBy === 'Ada Reyes'
        ? [`<run-${run.id}-verdict-uploader@bellkeep> Run ${run.id} of Fen link (unbooked) is analysed: ${run.verdict}; it awaits sign-off by another shift lead`]
        : []),
    ]);
    const caught = mails.map((mail) => `${mail.headers['message-id']} ${mail.subject}`);
    expect(caught.sort()).toEqual(expected.sort());
  });

  it('archives exactly the uploaded logs, each with its record, and nothing else', async () => {
    const { kept, leftovers } = await settledArchiveContents(testApp.config);
    const records = (await testApp.database.models.ArchiveFile.findAll()).map((record) => record.sha256.trim()).sort();
    expect(leftovers).toEqual([]);
    expect(kept).toEqual(records);
    expect(kept).toEqual(runs.map((run) => run.file.sha256).sort());
  });
});
