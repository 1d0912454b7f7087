import request from 'supertest';
import type { ApiErrorBody, AuditEventDto, LedgerDto, RunDto, RunPageDto, WithdrawalDto, WorklistDto } from '@shared/api';
import { archiveContents } from '../support/archive-contents';
import { demoTokens } from '../support/demo-tokens';
import { fixtureLog, inbox, setupId, uploadLog, waitForFinishedRun, waitForMail } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

describe('withdrawing a mistaken upload before its sign-off', () => {
  let testApp: TestApp;
  let tokens: Record<string, string>;
  const bearer = (who: string) => ({ Authorization: `Bearer ${tokens[who]}` });
  let fenLink: number;
  /** Uploaded before the worker starts, and withdrawn while still queued. */
  let queuedRun: RunDto;

  beforeAll(async () => {
    testApp = await createTestApp();
    tokens = await demoTokens(testApp, ['dev', 'lucia', 'sami', 'maren']);
    fenLink = await setupId(testApp.app, tokens['dev'], 'Fen link');
    queuedRun = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('drifting-run.csv'), { setupId: fenLink, acquiredOn: '2026-12-03' }).expect(201)).body as RunDto;
    await request(testApp.app).post(`/api/runs/${queuedRun.id}/withdraw`).set(bearer('dev')).send({ reason: 'Uploaded the calibration night by mistake.' }).expect(201);
    await testApp.startWorker();
  }, 120_000);
  afterAll(() => testApp.close());

  const withdraw = (runId: number, who: string, reason: unknown) => request(testApp.app).post(`/api/runs/${runId}/withdraw`).set(bearer(who)).send({ reason });
  const finishedUpload = async (file: string, acquiredOn: string) =>
    waitForFinishedRun(
      testApp.app,
      tokens['dev'],
      ((await uploadLog(testApp.app, tokens['dev'], fixtureLog(file), { setupId: fenLink, acquiredOn }).expect(201)).body as RunDto).id,
    );
  const trailOf = async (runId: number) => (await request(testApp.app).get(`/api/runs/${runId}/trail`).set(bearer('sami')).expect(200)).body as AuditEventDto[];

  it('by its uploader, with a reason: kept in the archive and the trail, marked withdrawn, no longer awaiting sign-off, mailed to the recipients', async () => {
    const run = await finishedUpload('accepted-run.csv', '2026-12-01');
    const refusedEmpty = (await withdraw(run.id, 'dev', '   ').expect(400)).body as ApiErrorBody;
    expect(refusedEmpty.error.field).toBe('reason');
    expect(((await withdraw(run.id, 'lucia', 'Not mine to take back.').expect(403)).body as ApiErrorBody).error.message).toBe(
      `Only the person who uploaded run ${run.id} or an admin can withdraw it.`,
    );
    await withdraw(run.id, 'sami', 'Auditors read, they do not withdraw.').expect(403);

    const withdrawal = (await withdraw(run.id, 'dev', '  Wrong setup: this was the Reed bench log.  ').expect(201)).body as WithdrawalDto;
    expect(withdrawal).toMatchObject({ userName: 'Dev Okafor', reason: 'Wrong setup: this was the Reed bench log.' });
    await withdraw(run.id, 'dev', 'Again.').expect(409);

    const shown = (await request(testApp.app).get(`/api/runs/${run.id}`).set(bearer('sami')).expect(200)).body as RunDto;
    expect(shown).toMatchObject({ withdrawn: true, withdrawal, state: 'accepted', verdict: 'ACCEPT' });
    const awaiting = (await request(testApp.app).get('/api/runs?awaitingSignOff=true').set(bearer('lucia')).expect(200)).body as RunPageDto;
    expect(awaiting.items.map((item) => item.id)).not.toContain(run.id);
    const worklist = (await request(testApp.app).get('/api/worklist').set(bearer('lucia')).expect(200)).body as WorklistDto;
    expect(worklist.lists.find((list) => list.kind === 'sign-off')!.items.map((item) => item.runId)).not.toContain(run.id);
    const refusedSignOff = await request(testApp.app).post(`/api/runs/${run.id}/sign-off`).set(bearer('lucia')).send({ decision: 'key-discarded', comment: 'Late.' });
    expect(refusedSignOff.status).toBe(409);
    expect((refusedSignOff.body as ApiErrorBody).error.message).toBe(`Run ${run.id} was withdrawn as a mistaken upload; there is nothing to sign off.`);

    const ledger = (await request(testApp.app).get('/api/ledger?from=2026-12-01&to=2026-12-03').set(bearer('sami')).expect(200)).body as LedgerDto;
    const cell = ledger.setups.find((setup) => setup.setupId === fenLink)!.cells.find((candidate) => candidate.night === '2026-12-01')!;
    expect(cell.run).toMatchObject({ id: run.id, withdrawn: true, signedOff: false });

    const trail = await trailOf(run.id);
    expect(trail.find((event) => event.action === 'run.withdrawn')).toMatchObject({
      actor: 'Dev Okafor',
      details: { reason: 'Wrong setup: this was the Reed bench log.', state: 'accepted', verdict: 'ACCEPT' },
    });
    expect((await archiveContents(testApp.config)).kept).toContain(run.file.sha256);

    const mail = await waitForMail(testApp.mailCatcher.inboxUrl, `Run ${run.id} of Fen link was withdrawn as a mistaken upload; it needs no sign-off`);
    expect(mail.text).toContain('Dev Okafor withdrew run');
    expect(mail.text).toContain('after its verdict (ACCEPT)');
    expect(mail.text).toContain('Why: Wrong setup: this was the Reed bench log.');
    expect(mail.to.map((to) => to.address)).toContain('lucia.brandt@kestrelfen.example');
  }, 60_000);

  it('is refused once the run is signed off, and an admin may withdraw anyone’s upload', async () => {
    const signed = await finishedUpload('aborted-low-chsh.csv', '2026-12-02');
    await request(testApp.app).post(`/api/runs/${signed.id}/sign-off`).set(bearer('lucia')).send({ decision: 'hardware-action', comment: 'Detector B re-aligned.' }).expect(201);
    expect(((await withdraw(signed.id, 'dev', 'Too late.').expect(409)).body as ApiErrorBody).error.message).toBe(
      `Run ${signed.id} is signed off already; a signed-off run cannot be withdrawn.`,
    );

    const other = await finishedUpload('biased-setting-rng.csv', '2026-12-02');
    await withdraw(other.id, 'maren', 'Duplicate of the night’s log, sent from the wrong station computer.').expect(201);
    expect(((await request(testApp.app).get(`/api/runs/${other.id}`).set(bearer('dev')).expect(200)).body as RunDto).withdrawal?.userName).toBe('Maren Holt');
  }, 60_000);

  it('withdrawn while queued: the analysis still runs and is kept, but no verdict mail goes out', async () => {
    const finished = await waitForFinishedRun(testApp.app, tokens['dev'], queuedRun.id);
    expect(finished.withdrawn).toBe(true);
    expect(finished.result).not.toBeNull();
    const deadline = Date.now() + 20_000;
    let skipped: AuditEventDto | undefined;
    while (!(skipped = (await trailOf(queuedRun.id)).find((event) => event.action === 'run.mail-skipped')) && Date.now() < deadline) {
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    expect(skipped?.details).toEqual({ reason: 'the upload was withdrawn before its verdict' });
    const mails = await inbox(testApp.mailCatcher.inboxUrl);
    expect(mails.some((mail) => mail.subject.startsWith(`Run ${queuedRun.id} of Fen link is analysed`))).toBe(false);
    expect(mails.find((mail) => mail.subject.startsWith(`Run ${queuedRun.id} of Fen link was withdrawn`))?.text).toContain('before its analysis ended (queued)');
  }, 60_000);
});
