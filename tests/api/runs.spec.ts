import crypto from 'node:crypto';
import fs from 'node:fs';
import request from 'supertest';
import { analyseLog } from '@shared/analysis/node';
import type { AnalysisResult } from '@shared/analysis/result';
import type { ApiErrorBody, AuditEventDto, AuditPageDto, RunDto, RunPageDto, SetupDto, UserDto } from '@shared/api';
import { archiveContents } from '../support/archive-contents';
import { demoTokens } from '../support/demo-tokens';
import { createTestApp, type TestApp } from '../support/test-app';
import { fixtureLog, inbox, setupId, uploadLog, waitForFinishedRun, waitForMail } from '../support/runs-api';

describe('the runs pipeline through the API', () => {
  let testApp: TestApp;
  const tokens: Record<string, string> = {};
  const bearer = (who: string) => ({ Authorization: `Bearer ${tokens[who]}` });
  let fenLink: number;

  beforeAll(async () => {
    testApp = await createTestApp();
    await testApp.startWorker();
    Object.assign(tokens, await demoTokens(testApp, ['dev', 'lucia', 'sami', 'ada', 'maren']));
    fenLink = await setupId(testApp.app, tokens['dev'], 'Fen link');
  }, 60_000);
  afterAll(() => testApp.close());

  it('upload → queued → analysed with the setup’s profile → verdict mailed to the shift leads → signed off once', async () => {
    const created = await uploadLog(testApp.app, tokens['dev'], fixtureLog('accepted-run.csv'), { setupId: fenLink, acquiredOn: '2026-11-30', notes: 'Night 42' }).expect(201);
    const queued = created.body as RunDto;
    expect(queued).toMatchObject({ state: 'queued', setupName: 'Fen link', profileName: 'Nightly standard', acquiredOn: '2026-11-30', duplicateOf: null });
    expect(queued.seed).toMatch(/^[0-9a-f]{64}$/);
    expect(queued.file.sha256).toBe(
      crypto
        .createHash('sha256')
        .update(fs.readFileSync(fixtureLog('accepted-run.csv')))
        .digest('hex'),
    );

    const run = await waitForFinishedRun(testApp.app, tokens['sami'], queued.id);
    expect(run).toMatchObject({ state: 'accepted', verdict: 'ACCEPT', progress: 1 });

    // The stored result is the engine's own, exactly: the same analysis in this process agrees to the fingerprint.
    const direct = await analyseLog(
      { path: fixtureLog('accepted-run.csv') },
      { profile: (await testApp.services.profiles.findVersion(run.profileVersionId)).parameters, seed: queued.seed },
    );
    expect(run.result).toEqual(JSON.parse(JSON.stringify(direct)));
    const result = run.result as unknown as AnalysisResult;
    // The upload took the log's census on the way (the header is a record of its text too).
    const archived = await testApp.database.models.ArchiveFile.findByPk(queued.file.sha256);
    expect(archived!.census).toMatchObject({ decodedBytes: fs.statSync(fixtureLog('accepted-run.csv')).size, records: result.input.rounds + 1, marks: [] });

    const mail = await waitForMail(testApp.mailCatcher.inboxUrl, `Run ${run.id} of Fen link (unbooked) is analysed: ACCEPT; it awaits sign-off`);
    expect(mail.to.map((to) => to.address).sort()).toEqual(['ada.reyes@kestrelfen.example', 'lucia.brandt@kestrelfen.example', 'night-desk@kestrelfen.example']);
    expect(mail.text).toContain(`CHSH win fraction ${result.chsh!.winFraction!.toFixed(4)}`);
    expect(mail.text).toContain(`S = ${result.chsh!.S!.toFixed(3)}`);
    expect(mail.text).toContain('collective');
    expect(mail.text).toContain(`/runs/${run.id}`);
    expect(mail.html).toContain('<a href=');

    const delivered = (await request(testApp.app).get(`/api/runs/${run.id}`).set(bearer('lucia')).expect(200)).body as RunDto;
    expect(delivered.deliveries).toEqual([expect.objectContaining({ status: 'sent', messageId: `<run-${run.id}-verdict@bellkeep>` })]);

    const signOffOf = (who: string, body: object) => request(testApp.app).post(`/api/runs/${run.id}/sign-off`).set(bearer(who)).send(body);
    await signOffOf('sami', { decision: 'key-discarded', comment: 'looks fine' }).expect(403);
    await signOffOf('lucia', { decision: 'key-discarded', comment: '' }).expect(400);
    const undecided = await signOffOf('lucia', { comment: 'no decision' }).expect(400);
    expect((undecided.body as ApiErrorBody).error.field).toBe('decision');
    // This ACCEPT extracts no key at its size: none can be kept.
    expect(result.key!.finiteKeyBits).toBe(0);
    const noKey = await signOffOf('lucia', { decision: 'key-kept', comment: 'keep it' }).expect(400);
    expect((noKey.body as ApiErrorBody).error.message).toBe(
      `No key can be kept from run ${run.id}: its finite key is 0 bits at this size. Sign it off as key discarded or hardware action needed.`,
    );
    const signOff = await signOffOf('lucia', { decision: 'key-discarded', comment: 'Too short for a key; fibre swap tomorrow.' }).expect(201);
    expect(signOff.body).toMatchObject({ userName: 'Lucia Brandt', decision: 'key-discarded', comment: 'Too short for a key; fibre swap tomorrow.' });
    await signOffOf('ada', { decision: 'hardware-action', comment: 'again' }).expect(409);
    expect(((await request(testApp.app).get(`/api/runs/${run.id}`).set(bearer('dev')).expect(200)).body as RunDto).signOff).toMatchObject({ decision: 'key-discarded' });

    const trail = (await request(testApp.app).get(`/api/runs/${run.id}/trail`).set(bearer('sami')).expect(200)).body as AuditEventDto[];
    expect(trail.map((event) => event.action)).toEqual(['run.uploaded', 'run.analysis-started', 'run.finished', 'run.mail-sent', 'run.signed-off']);
    expect(trail[0].actor).toBe('Dev Okafor');
  }, 60_000);

  it('under the four-eyes rule nobody signs off a run they uploaded, until an admin turns the rule off for the setup, which the trail records', async () => {
    const created = (await uploadLog(testApp.app, tokens['ada'], fixtureLog('accepted-run.csv'), { setupId: fenLink }).expect(201)).body as RunDto;
    const run = await waitForFinishedRun(testApp.app, tokens['ada'], created.id);
    const ada = (await request(testApp.app).get('/api/auth/me').set(bearer('ada')).expect(200)).body as UserDto;
    expect(run).toMatchObject({ uploadedById: ada.id, fourEyes: true });
    const refused = await request(testApp.app).post(`/api/runs/${run.id}/sign-off`).set(bearer('ada')).send({ decision: 'key-discarded', comment: 'mine' }).expect(403);
    expect((refused.body as ApiErrorBody).error.message).toBe(`You uploaded run ${run.id}; under the four-eyes rule of Fen link another shift lead signs it off.`);
    // The mail does not offer her the sign-off either: she gets her own, the others the link.
    const hers = await waitForMail(testApp.mailCatcher.inboxUrl, `Run ${run.id} of Fen link (unbooked) is analysed: ACCEPT; it awaits sign-off by another shift lead`);
    expect(hers.to.map((to) => to.address)).toEqual(['ada.reyes@kestrelfen.example']);
    expect(hers.text).toContain('You uploaded this run: under the setup’s four-eyes rule another shift lead signs it off.');
    expect(hers.text).not.toContain('#sign-off');
    expect(hers.text).not.toContain('Sign it off');
    const theirs = await waitForMail(testApp.mailCatcher.inboxUrl, `Run ${run.id} of Fen link (unbooked) is analysed: ACCEPT; it awaits sign-off`);
    expect(theirs.to.map((to) => to.address).sort()).toEqual(['lucia.brandt@kestrelfen.example', 'night-desk@kestrelfen.example']);
    expect(theirs.text).toContain(`Sign it off: `);
    expect(theirs.text).toContain(`/runs/${run.id}#sign-off`);

    const setup = (await request(testApp.app).get(`/api/setups/${fenLink}`).set(bearer('maren')).expect(200)).body as SetupDto;
    const { id: _id, defaultProfileName: _profile, shiftLeads, createdAt: _created, columnMapping: _mapping, ...fields } = setup;
    const saved = { ...fields, shiftLeadIds: shiftLeads.map((lead) => lead.id), fourEyes: false };
    await request(testApp.app).put(`/api/setups/${fenLink}`).set(bearer('lucia')).send(saved).expect(403);
    expect(((await request(testApp.app).put(`/api/setups/${fenLink}`).set(bearer('maren')).send(saved).expect(200)).body as SetupDto).fourEyes).toBe(false);
    const trail = (await request(testApp.app).get('/api/audit').query({ action: 'setup.changed' }).set(bearer('sami')).expect(200)).body as AuditPageDto;
    // The line names the setup and says what changed, field by field.
    expect(trail.items[0]).toMatchObject({ targetName: 'Fen link', details: { fourEyes: false, changes: { fourEyes: { from: true, to: false } } } });

    await request(testApp.app).post(`/api/runs/${run.id}/sign-off`).set(bearer('ada')).send({ decision: 'hardware-action', comment: 'Detector B needs cooling.' }).expect(201);
    await request(testApp.app)
      .put(`/api/setups/${fenLink}`)
      .set(bearer('maren'))
      .send({ ...saved, fourEyes: true })
      .expect(200);
  }, 60_000);

  it('a shift lead of another setup cannot sign off', async () => {
    const bench = await setupId(testApp.app, tokens['dev'], 'Mill Lane bench');
    const created = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('accepted-run.csv'), { setupId: bench }).expect(201)).body as RunDto;
    await waitForFinishedRun(testApp.app, tokens['dev'], created.id);
    const refused = await request(testApp.app).post(`/api/runs/${created.id}/sign-off`).set(bearer('lucia')).send({ decision: 'key-discarded', comment: 'not mine' }).expect(403);
    expect((refused.body as ApiErrorBody).error.message).toMatch(/assigned to this run’s setup/);
  }, 60_000);

  it('a log with low CHSH is aborted, with the reason in the result and the mail', async () => {
    const created = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('aborted-low-chsh.csv'), { setupId: fenLink }).expect(201)).body as RunDto;
    const run = await waitForFinishedRun(testApp.app, tokens['dev'], created.id);
    expect(run).toMatchObject({ state: 'aborted', verdict: 'ABORT' });
    const reasons = (run.result as unknown as AnalysisResult).reasons;
    expect(reasons.length).toBeGreaterThan(0);
    const mail = await waitForMail(testApp.mailCatcher.inboxUrl, `Run ${run.id} of Fen link (unbooked) is analysed: ABORT; it awaits sign-off`);
    expect(mail.text).toContain(reasons[0]);
  }, 60_000);

  it.each(['malformed-rows.csv', 'empty.csv', 'header-only.csv', 'missing-column.csv', 'binary.bin'])(
    'the malformed fixture %s ends as an invalid run with its problems listed, not as a server error',
    async (name) => {
      const created = (await uploadLog(testApp.app, tokens['dev'], fixtureLog(name), { setupId: fenLink }).expect(201)).body as RunDto;
      const run = await waitForFinishedRun(testApp.app, tokens['dev'], created.id);
      expect(run).toMatchObject({ state: 'invalid', verdict: 'INVALID' });
      const result = run.result as unknown as AnalysisResult;
      expect(result.errorCount).toBeGreaterThan(0);
      expect(result.errors[0].message.length).toBeGreaterThan(10);
    },
    60_000,
  );

  it('the same bytes again: a new run of the same archived file, marked as a duplicate', async () => {
    const first = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('drifting-run.csv'), { setupId: fenLink }).expect(201)).body as RunDto;
    const second = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('drifting-run.csv'), { setupId: fenLink }).expect(201)).body as RunDto;
    expect(second.duplicateOf).toBe(first.id);
    // Uploading the same bytes again draws no new seed: no re-upload can shop for test rounds.
    expect(second.seed).toBe(first.seed);
    expect(second.file.sha256).toBe(first.file.sha256);
    const { kept, leftovers } = await archiveContents(testApp.config);
    expect(kept.filter((sha256) => sha256 === first.file.sha256)).toHaveLength(1);
    expect(leftovers).toEqual([]);
  });

  it('makes one run of repeated requests with one Idempotency-Key, even at the same moment', async () => {
    const before = await testApp.database.models.Run.count();
    const send = () => uploadLog(testApp.app, tokens['dev'], fixtureLog('aborted-low-chsh.csv'), { setupId: fenLink }).set('Idempotency-Key', 'fen-night-42-attempt-1');
    const [first, second] = await Promise.all([send(), send()]);
    // One claims the key and makes the run (201); the other gets that run (200) or, while the first
    // is still being received, a 409 that says so.
    expect([first.status, second.status].sort()).toEqual(expect.arrayContaining([201]));
    expect([200, 201, 409]).toEqual(expect.arrayContaining([first.status, second.status]));
    const made = (first.status === 201 ? first : second).body as RunDto;
    const later = await send().expect(200);
    expect((later.body as RunDto).id).toBe(made.id);
    expect(await testApp.database.models.Run.count()).toBe(before + 1);
    expect((await archiveContents(testApp.config)).leftovers).toEqual([]);
  });

  it('gives a key back when its upload fails, and refuses a malformed key naming the header', async () => {
    await uploadLog(testApp.app, tokens['dev'], fixtureLog('accepted-run.csv'), { setupId: fenLink, profileId: 2 }).set('Idempotency-Key', 'retry-me').expect(403);
    const retried = await uploadLog(testApp.app, tokens['dev'], fixtureLog('accepted-run.csv'), { setupId: fenLink }).set('Idempotency-Key', 'retry-me').expect(201);
    expect((retried.body as RunDto).setupName).toBe('Fen link');
    const refused = await uploadLog(testApp.app, tokens['dev'], fixtureLog('accepted-run.csv'), { setupId: fenLink }).set('Idempotency-Key', 'with space').expect(400);
    expect((refused.body as ApiErrorBody).error.field).toBe('Idempotency-Key');
  });

  it.each([[{ profileId: 2 }], [{ profileVersionId: 4242 }]])('refuses %j, a profile other than the setup’s, with 403 saying why, keeping nothing', async (fields) => {
    const before = await testApp.database.models.Run.count();
    const response = await uploadLog(testApp.app, tokens['dev'], fixtureLog('accepted-run.csv'), { setupId: fenLink, ...fields }).expect(403);
    expect((response.body as ApiErrorBody).error.message).toContain('Logs of Fen link, unbooked, are judged under the profile fixed for them');
    expect(await testApp.database.models.Run.count()).toBe(before);
    expect((await archiveContents(testApp.config)).leftovers).toEqual([]);
  });

  it.each([
    [{}, 'setupId'],
    [{ setupId: 999 }, 'setupId'],
    [{ setupId: 'abc' }, 'setupId'],
    [{ seed: 'not-hex' }, 'seed'],
    [{ mapping: '{"columns": {"x": ""}}' }, 'mapping'],
    [{ mapping: '{not json' }, 'mapping'],
    [{ acquiredOn: '2026-13-40' }, 'acquiredOn'],
    [{ acquiredOn: '2999-03-14' }, 'acquiredOn'],
    [{ colour: 'teal' }, ''],
  ])('refuses the fields %j with 400 naming the field, keeping nothing', async (fields, field) => {
    const body = { setupId: fenLink, ...fields } as Record<string, string | number>;
    if (!('setupId' in fields) && field === 'setupId') delete body['setupId'];
    const before = await testApp.database.models.Run.count();
    const response = await uploadLog(testApp.app, tokens['dev'], fixtureLog('accepted-run.csv'), body).expect(400);
    const error = (response.body as ApiErrorBody).error;
    if (field) expect(error.field).toBe(field);
    else expect(error.message).toMatch(/colour/);
    expect(await testApp.database.models.Run.count()).toBe(before);
    expect((await archiveContents(testApp.config)).leftovers).toEqual([]);
  });

  it('refuses a form whose file name holds a control character with 400 saying so, not a server error', async () => {
    const log = { bytes: fs.readFileSync(fixtureLog('malformed-rows.csv')), name: 'night\u0007.csv' };
    const response = await uploadLog(testApp.app, tokens['dev'], log, { setupId: fenLink }).expect(400);
    expect((response.body as ApiErrorBody).error.message).toBe('The upload is no well-formed multipart form: Malformed part header.');
  });

  it('keeps a file name written in UTF-8 as written', async () => {
    const log = { bytes: fs.readFileSync(fixtureLog('malformed-rows.csv')), name: 'ночь-42 über Fen 🌙.csv' };
    const created = (await uploadLog(testApp.app, tokens['dev'], log, { setupId: fenLink }).expect(201)).body as RunDto;
    expect(created.file.originalName).toBe('ночь-42 über Fen 🌙.csv');
  });

  it('answers more uploads at once than the database pool has connections', async () => {
    // Each upload's transaction holds a pooled connection, so a query beside it waits for another.
    // These are refused in the transaction (another profile), after the setup's profile is read there.
    const uploads = Array.from({ length: 24 }, () => uploadLog(testApp.app, tokens['dev'], fixtureLog('malformed-rows.csv'), { setupId: fenLink, profileId: 2 }));
    expect((await Promise.all(uploads)).map((response) => response.status)).toEqual(uploads.map(() => 403));
  }, 50_000);

  it('refuses an upload without a file', async () => {
    const response = await request(testApp.app).post('/api/runs').set(bearer('dev')).field('setupId', String(fenLink)).expect(400);
    expect((response.body as ApiErrorBody).error.field).toBe('log');
  });

  it('lists runs with paging, sorting and filters', async () => {
    const page = (await request(testApp.app).get('/api/runs').query({ pageSize: 2, page: 0, sort: 'createdAt', direction: 'asc' }).set(bearer('sami')).expect(200))
      .body as RunPageDto;
    expect(page.items).toHaveLength(2);
    expect(page.total).toBeGreaterThan(2);
    expect(page.items[0].id).toBeLessThan(page.items[1].id);

    const aborted = (await request(testApp.app).get('/api/runs').query({ verdict: 'ABORT' }).set(bearer('sami')).expect(200)).body as RunPageDto;
    expect(aborted.items.length).toBeGreaterThan(0);
    expect(aborted.items.every((item) => item.verdict === 'ABORT')).toBe(true);

    const accepted = (await request(testApp.app).get('/api/runs').query({ state: 'accepted', sort: 'winFraction', direction: 'desc' }).set(bearer('sami')).expect(200))
      .body as RunPageDto;
    expect(accepted.items.every((item) => item.winFraction! >= item.winThreshold!)).toBe(true);

    const dated = (await request(testApp.app).get('/api/runs').query({ from: '2026-11-30', to: '2026-11-30' }).set(bearer('sami')).expect(200)).body as RunPageDto;
    expect(dated.items.map((item) => item.acquiredOn)).toEqual(dated.items.map(() => '2026-11-30'));

    await request(testApp.app).get('/api/runs').query({ state: 'sleeping' }).set(bearer('sami')).expect(400);
    await request(testApp.app).get('/api/runs').query({ pageSize: 5000 }).set(bearer('sami')).expect(400);
  });

  it('the mail goes out once the mail server is back, and only once', async () => {
    const { inboxUrl } = testApp.mailCatcher;
    await testApp.mailCatcher.stop();
    const created = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('biased-setting-rng.csv'), { setupId: fenLink }).expect(201)).body as RunDto;
    const run = await waitForFinishedRun(testApp.app, tokens['dev'], created.id);
    // Wait for at least one failed delivery, recorded with its error.
    for (let attempt = 0; ; attempt++) {
      const deliveries = ((await request(testApp.app).get(`/api/runs/${run.id}`).set(bearer('dev'))).body as RunDto).deliveries;
      if (deliveries.some((delivery) => delivery.status === 'failed' && delivery.error)) break;
      if (attempt > 200) throw new Error('no failed delivery recorded');
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    await testApp.restartMailCatcher();
    const subject = `Run ${run.id} of Fen link (unbooked) is analysed: ${run.verdict}; it awaits sign-off`;
    await waitForMail(inboxUrl, subject);
    await new Promise((resolve) => setTimeout(resolve, 2500));
    expect((await inbox(inboxUrl)).filter((mail) => mail.subject === subject)).toHaveLength(1);
    const deliveries = ((await request(testApp.app).get(`/api/runs/${run.id}`).set(bearer('dev'))).body as RunDto).deliveries;
    expect(deliveries.filter((delivery) => delivery.status === 'sent')).toHaveLength(1);
  }, 60_000);
});
