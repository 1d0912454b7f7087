import request from 'supertest';
import type { ApiErrorBody, ProfileDto, SetupDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { archiveContents, settledArchiveContents } from '../support/archive-contents';
import { createTestApp, type TestApp } from '../support/test-app';
import { breakOffUpload, fixtureLog, setupId, uploadLog } from '../support/runs-api';

describe('profiles, setups and what the database itself guards', () => {
  let testApp: TestApp;
  let admin: string;
  let dev: string;

  beforeAll(async () => {
    testApp = await createTestApp({ BELLKEEP_UPLOAD_LIMIT_BYTES: '100000' });
    admin = await testApp.signIn('maren.holt@kestrelfen.example', DEMO_PASSWORD);
    dev = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
  });
  afterAll(() => testApp.close());

  it('seeds two profiles with complete parameters', async () => {
    const profiles = (await request(testApp.app).get('/api/profiles').set('Authorization', `Bearer ${dev}`).expect(200)).body as ProfileDto[];
    expect(profiles.map((profile) => profile.name)).toEqual(['Certified key', 'Nightly standard']);
    expect(profiles[1].versions[0].parameters).toMatchObject({ testSelection: { mode: 'fixed-fraction', fraction: 0.5 }, epsilon: 1e-9, minTestRounds: 1000 });
  });

  it('editing a profile writes a new version and leaves the old one as it was', async () => {
    const [, nightly] = (await request(testApp.app).get('/api/profiles').set('Authorization', `Bearer ${admin}`).expect(200)).body as ProfileDto[];
    const before = nightly.versions[0];
    const changed = (
      await request(testApp.app)
        .post(`/api/profiles/${nightly.id}/versions`)
        .set('Authorization', `Bearer ${admin}`)
        .send({ parameters: { ...before.parameters, chshTolerance: 0.02 }, note: 'Tighter after the fibre swap' })
        .expect(201)
    ).body as ProfileDto;
    expect(changed.versions.map((version) => version.version)).toEqual([2, 1]);
    expect(changed.latestVersionId).toBe(changed.versions[0].id);
    expect(changed.versions[0]).toMatchObject({ note: 'Tighter after the fibre swap', createdBy: 'Maren Holt' });
    expect(changed.versions[1].parameters).toEqual(before.parameters);
  });

  it('a bad profile is refused naming the field', async () => {
    const response = await request(testApp.app)
      .post('/api/profiles')
      .set('Authorization', `Bearer ${admin}`)
      .send({ name: 'Loose', parameters: { chshTolerance: 0.7 } })
      .expect(400);
    expect((response.body as ApiErrorBody).error.field).toBe('parameters.chshTolerance');
    expect((response.body as ApiErrorBody).error.message).toMatch(/chshTolerance/);
  });

  it('the database refuses to change a profile version, and to change or delete the audit trail', async () => {
    const { sequelize } = testApp.database;
    await expect(sequelize.query("UPDATE profile_versions SET note = 'rewritten'")).rejects.toThrow(/fixed once written/);
    await expect(sequelize.query("UPDATE audit_events SET action = 'nothing'")).rejects.toThrow(/append-only/);
    await expect(sequelize.query('DELETE FROM audit_events')).rejects.toThrow(/append-only/);
    await expect(sequelize.query('TRUNCATE audit_events')).rejects.toThrow(/append-only/);
  });

  it('admins edit setups and their shift leads; a shift lead must hold the role', async () => {
    const fen = await setupId(testApp.app, admin, 'Fen link');
    const current = (await request(testApp.app).get(`/api/setups/${fen}`).set('Authorization', `Bearer ${admin}`).expect(200)).body as SetupDto;
    const body = {
      name: current.name,
      description: current.description,
      stationALabel: current.stationALabel,
      stationBLabel: current.stationBLabel,
      defaultProfileId: current.defaultProfileId,
      shiftLeadIds: current.shiftLeads.map((lead) => lead.id).slice(0, 1),
      extraRecipients: ['Night-Desk@kestrelfen.example'],
    };
    const saved = (await request(testApp.app).put(`/api/setups/${fen}`).set('Authorization', `Bearer ${admin}`).send(body).expect(200)).body as SetupDto;
    expect(saved.shiftLeads).toHaveLength(1);
    expect(saved.extraRecipients).toEqual(['night-desk@kestrelfen.example']);

    const devId = ((await request(testApp.app).get('/api/auth/me').set('Authorization', `Bearer ${dev}`)).body as { id: number }).id;
    const refused = await request(testApp.app)
      .put(`/api/setups/${fen}`)
      .set('Authorization', `Bearer ${admin}`)
      .send({ ...body, shiftLeadIds: [devId] })
      .expect(400);
    expect((refused.body as ApiErrorBody).error.field).toBe('shiftLeadIds');
  });

  it('a setup keeps where its stations are: the distance, and a clock offset only with its uncertainty', async () => {
    const fen = await setupId(testApp.app, admin, 'Fen link');
    const current = (await request(testApp.app).get(`/api/setups/${fen}`).set('Authorization', `Bearer ${admin}`).expect(200)).body as SetupDto;
    const body = {
      name: current.name,
      stationALabel: current.stationALabel,
      stationBLabel: current.stationBLabel,
      defaultProfileId: current.defaultProfileId,
      shiftLeadIds: current.shiftLeads.map((lead) => lead.id),
    };
    const put = (extra: object) =>
      request(testApp.app)
        .put(`/api/setups/${fen}`)
        .set('Authorization', `Bearer ${admin}`)
        .send({ ...body, ...extra });
    expect(((await put({ clockOffsetNs: 12.5 }).expect(400)).body as ApiErrorBody).error.field).toBe('clockUncertaintyNs');
    expect(((await put({ stationDistanceM: -3 }).expect(400)).body as ApiErrorBody).error.field).toBe('stationDistanceM');
    const saved = (await put({ stationDistanceM: 1200, clockOffsetNs: -12.5, clockUncertaintyNs: 0.8 }).expect(200)).body as SetupDto;
    expect(saved).toMatchObject({ stationDistanceM: 1200, clockOffsetNs: -12.5, clockUncertaintyNs: 0.8 });
    // Left out, they stay as they are; null forgets them.
    expect(((await put({}).expect(200)).body as SetupDto).stationDistanceM).toBe(1200);
    expect(((await put({ stationDistanceM: null, clockOffsetNs: null, clockUncertaintyNs: null }).expect(200)).body as SetupDto).clockOffsetNs).toBeNull();
  });

  it('a log over the upload limit gets 413 and leaves nothing behind', async () => {
    const fen = await setupId(testApp.app, dev, 'Fen link');
    const response = await uploadLog(testApp.app, dev, fixtureLog('accepted-run.csv'), { setupId: fen }).expect(413);
    expect((response.body as ApiErrorBody).error.message).toMatch(/upload limit of 100000 bytes/);
    expect(await testApp.database.models.Run.count()).toBe(0);
    expect(await archiveContents(testApp.config)).toEqual({ kept: [], leftovers: [] });
  });

  it('an upload broken off half-way leaves no run and no stray file', async () => {
    const fen = await setupId(testApp.app, dev, 'Fen link');
    await breakOffUpload(testApp.app, dev, fen, '0,0,1,0,0\n'.repeat(2000), () => new Promise((resolve) => setTimeout(resolve, 300)));
    expect(await settledArchiveContents(testApp.config)).toEqual({ kept: [], leftovers: [] });
    expect(await testApp.database.models.Run.count()).toBe(0);
    expect(await testApp.database.models.ArchiveFile.count()).toBe(0);
  });
});
