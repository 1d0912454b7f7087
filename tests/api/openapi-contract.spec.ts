import fs from 'node:fs';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@seeders/data/demo-people';
import type { CreatedUploadTokenDto, ProfileDto, RunDto, UserDto } from '@shared/api';
import { contractCheckedRequest, createContractChecker, documentedOperations } from '../support/api-contract';
import { fixtureLog, inbox, waitForFinishedRun } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(120_000);

const TUS = { 'Tus-Resumable': '1.0.0' };
const tusMetadata = (fields: Record<string, string>) =>
  Object.entries(fields)
    .map(([name, value]) => `${name} ${Buffer.from(value).toString('base64')}`)
    .join(',');

/**
 * Calls every operation of the API once, as someone allowed to, and checks each answer against
 * the OpenAPI document (its status documented, its JSON body fitting the schema).
 */
describe('every operation answers as the OpenAPI document says', () => {
  let testApp: TestApp;
  const checker = createContractChecker();
  let api: ReturnType<typeof contractCheckedRequest>;
  const bearer = new Map<string, { Authorization: string }>();
  const as = (email: string) => bearer.get(email)!;
  const admin = () => as('maren.holt@kestrelfen.example');
  const experimentalist = () => as('dev.okafor@kestrelfen.example');
  const shiftLead = () => as('lucia.brandt@kestrelfen.example');
  const auditor = () => as('sami.virtanen@kestrelfen.example');

  beforeAll(async () => {
    testApp = await createTestApp();
    api = contractCheckedRequest(testApp.app, checker);
    for (const person of DEMO_PEOPLE) bearer.set(person.email, { Authorization: `Bearer ${await testApp.signIn(person.email, DEMO_PASSWORD)}` });
    await testApp.startWorker();
  });
  afterAll(() => testApp.close());

  it('signing in and the people', async () => {
    await api.post('/api/auth/login').send({ email: 'sami.virtanen@kestrelfen.example', password: DEMO_PASSWORD }).expect(200);
    await api.post('/api/auth/login').send({ email: 'sami.virtanen@kestrelfen.example', password: 'not the password' }).expect(401);
    await api.get('/api/auth/me').set(auditor()).expect(200);
    await api.get('/api/users').set(admin()).expect(200);
    await api.get('/api/users').set(auditor()).expect(403);
    const created = (
      await api
        .post('/api/users')
        .set(admin())
        .send({ email: 'contract.check@kestrelfen.example', name: 'Contract Check', password: 'long-enough-2026', roles: ['auditor'] })
        .expect(201)
    ).body as UserDto;
    await api
      .post('/api/users')
      .set(admin())
      .send({ email: 'not an address', name: 'X', password: 'long-enough-2026', roles: ['auditor'] })
      .expect(400);
    await api
      .patch(`/api/users/${created.id}`)
      .set(admin())
      .send({ roles: ['auditor', 'shift-lead'] })
      .expect(200);

    const own = { Authorization: `Bearer ${await testApp.signIn('contract.check@kestrelfen.example', 'long-enough-2026')}` };
    await api.post('/api/auth/password').set(own).send({ currentPassword: 'long-enough-2026', newPassword: 'longer-still-2027' }).expect(200);
    await api.post(`/api/users/${created.id}/password-reset-link`).set(admin()).expect(201);
    const mail = (await inbox(testApp.mailCatcher.inboxUrl)).find((caught) => caught.subject === 'A link to set your Bellkeep password')!;
    const secret = /#([0-9a-f]{64})/.exec(mail.text)![1];
    await api.post('/api/auth/password-reset').send({ secret, newPassword: 'reset-by-link-2027' }).expect(204);
    await api.post('/api/auth/password-reset').send({ secret, newPassword: 'reset-by-link-2028' }).expect(400);
  });

  it('setups, profiles, bookings, upload tokens, the planner and the workers', async () => {
    await api.get('/api/setups').set(auditor()).expect(200);
    await api.get('/api/setups/1').set(auditor()).expect(200);
    await api.get('/api/setups/999999').set(auditor()).expect(404);
    const leads = ((await api.get('/api/users').set(admin()).expect(200)).body as UserDto[]).filter((user) => user.roles.includes('shift-lead'));
    const setup = { name: 'Contract bench', stationALabel: 'North hut', stationBLabel: 'South hut', defaultProfileId: 1, shiftLeadIds: [leads[0].id] };
    const made = (await api.post('/api/setups').set(admin()).send(setup).expect(201)).body as { id: number };
    await api
      .put(`/api/setups/${made.id}`)
      .set(admin())
      .send({ ...setup, description: 'Checked against the contract.' })
      .expect(200);
    await api
      .put(`/api/setups/${made.id}/column-mapping`)
      .set(experimentalist())
      .send({ mapping: { columns: { round: 'RoundNo' }, outcomes: '±1' } })
      .expect(200);

    await api.get('/api/profiles').set(auditor()).expect(200);
    const profile = (await api.get('/api/profiles/1').set(auditor()).expect(200)).body as ProfileDto;
    const { parameters } = profile.versions[0];
    await api.post('/api/profiles').set(admin()).send({ name: 'Contract profile', parameters }).expect(201);
    await api.post('/api/profiles/1/versions').set(admin()).send({ parameters, note: 'the same again' }).expect(201);

    await api.get('/api/setups/1/upload-tokens').set(admin()).expect(200);
    const token = (await api.post('/api/setups/1/upload-tokens').set(admin()).send({ name: 'contract computer', validDays: 2 }).expect(201)).body as CreatedUploadTokenDto;
    await api.post(`/api/setups/1/upload-tokens/${token.id}/revoke`).set(admin()).expect(200);

    const now = Date.now();
    const window = { windowStart: new Date(now + 60_000).toISOString(), windowEnd: new Date(now + 3_600_000).toISOString() };
    const booking = (
      await api
        .post('/api/bookings')
        .set(experimentalist())
        .send({ setupId: made.id, night: '2026-12-05', ...window, plannedRounds: 4000 })
        .expect(201)
    ).body as { id: number };
    await api.get(`/api/bookings?setupId=${made.id}`).set(auditor()).expect(200);
    await api.get(`/api/bookings/${booking.id}`).set(auditor()).expect(200);

    await api.get('/api/planner?qber=0.02&winFraction=0.84&profileVersionId=1&rounds=4000000').set(auditor()).expect(200);
    await api.get('/api/planner/general-attack?qber=0.02&winFraction=0.84&profileVersionId=1&rounds=100000000').set(auditor()).expect(200);
    await api.get('/api/planner/prefill?setupId=1').set(auditor()).expect(200);
    await api.get('/api/workers').set(admin()).expect(200);
    await api.get('/api/ledger').set(auditor()).expect(200);
    await api.get('/api/ledger?from=2026-12-05&to=2026-11-01').set(auditor()).expect(400);
    await api.get('/api/worklist').set(shiftLead()).expect(200);
  });

  it('runs: a multipart upload and a resumable one, their reads, the sign-off, the integrity checks and the exports', async () => {
    const log = fixtureLog('accepted-run.csv');
    const uploaded = (await api.post('/api/runs').set(experimentalist()).set('Idempotency-Key', 'contract-check-1').field('setupId', '1').attach('log', log).expect(201))
      .body as RunDto;
    await api.post('/api/runs').set(experimentalist()).field('setupId', '1').field('seed', 'ab').attach('log', log).expect(400);
    await waitForFinishedRun(testApp.app, experimentalist().Authorization.slice(7), uploaded.id);

    const bytes = fs.readFileSync(log);
    const created = await api
      .post('/api/uploads')
      .set({ ...experimentalist(), ...TUS, 'Upload-Length': String(bytes.length), 'Upload-Metadata': tusMetadata({ filename: 'night.csv', setupId: '1' }) })
      .expect(201);
    const location = created.headers['location'];
    await api
      .head(location)
      .set({ ...experimentalist(), ...TUS })
      .expect(200);
    await api
      .patch(location)
      .set({ ...experimentalist(), ...TUS, 'Upload-Offset': '0', 'Content-Type': 'application/offset+octet-stream' })
      .send(bytes)
      .expect(201);
    await api.get(location).set(experimentalist()).expect(200);

    await api.get('/api/runs?pageSize=5&sort=state&finished=true').set(auditor()).expect(200);
    await api.get(`/api/runs/${uploaded.id}`).set(auditor()).expect(200);
    await api.get(`/api/runs/${uploaded.id}/blocks`).set(auditor()).expect(200);
    await api.get(`/api/runs/${uploaded.id}/trail`).set(auditor()).expect(200);
    await api.post(`/api/runs/${uploaded.id}/sign-off`).set(shiftLead()).send({ decision: 'key-discarded', comment: 'Checked against the contract.' }).expect(201);
    await api.post(`/api/runs/${uploaded.id}/withdraw`).set(experimentalist()).send({ reason: 'Too late: it is signed off.' }).expect(409);
    await api.post(`/api/runs/${uploaded.id}/realign`).set(shiftLead()).send({ offset: 2, reason: 'A joined log has no records to pair.' }).expect(409);
    await api.get('/api/runs/station-logs?waiting=true').set(auditor()).expect(200);
    await api.get(`/api/runs/${uploaded.id}/verification`).set(auditor()).expect(200);
    await api.post(`/api/runs/${uploaded.id}/reverifications`).set(auditor()).send({}).expect(201);
    await api.get(`/api/runs/${uploaded.id}/reverifications`).set(auditor()).expect(200);
    await api.get(`/api/runs/${uploaded.id}/export/json`).set(auditor()).expect(200);
  });

  it('the trail, the published keys and what operators read', async () => {
    await api.get('/api/audit?pageSize=20&action=run.').set(auditor()).expect(200);
    await api.get('/api/audit/actors').set(auditor()).expect(200);
    await api.get('/api/audit/trail-check').set(auditor()).expect(200);
    await api.get('/api/audit/export.csv?targetType=run').set(auditor()).expect(200);
    await api.get('/api/signing-keys').expect(200);
    await api.get('/api/health').expect(200);
    await api.get('/api/ready').expect(200);
    await api.get('/metrics').set(admin()).expect(200);
    await api.get('/api/openapi.json').expect(200);
    await api.get('/api/reference').expect(200);
    await api.get('/api/reference/start.js').expect(200);
  });

  it('has called every documented operation', () => {
    const called = new Set([...checker.checked].map((answer) => answer.split(' ').slice(0, 2).join(' ')));
    expect(documentedOperations().filter((operation) => !called.has(operation))).toEqual([]);
  });
});
