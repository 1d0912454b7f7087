import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import http from 'node:http';
import path from 'node:path';
import request from 'supertest';
import type { ApiErrorBody, AuditEventDto, BookingDto, CreatedUploadTokenDto, RunDto, UploadTokenDto } from '@shared/api';
import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';
import { writeModelLog } from '@fixtures/model-log-file';
import { demoTokens } from '../support/demo-tokens';
import { createTestApp, type TestApp } from '../support/test-app';
import { setupId, uploadLog, waitForMail } from '../support/runs-api';

const HOUR = 3_600_000;
const sha256 = (text: string | Buffer) => crypto.createHash('sha256').update(text).digest('hex');

describe('booked nights and the acquisition computer', () => {
  let testApp: TestApp;
  const tokens: Record<string, string> = {};
  const bearer = (who: string) => ({ Authorization: `Bearer ${tokens[who] ?? who}` });
  let fenLink: number;
  let millLane: number;
  let scratch: string;
  let nights = 0;

  /** A small log of its own bytes (a steady device, a seed per call). */
  async function freshLog(): Promise<string> {
    const file = path.join(scratch, `night-${++nights}.csv`);
    await writeModelLog(file, { ...steadyPair, rounds: 4000 }, FIXTURE_SEED.slice(0, 56) + nights.toString(16).padStart(8, '0'));
    return file;
  }

  function book(who: string, fields: Record<string, unknown>) {
    const now = Date.now();
    return request(testApp.app)
      .post('/api/bookings')
      .set(bearer(who))
      .send({
        setupId: fenLink,
        night: '2026-12-04',
        windowStart: new Date(now - 60_000).toISOString(),
        windowEnd: new Date(now + 10 * HOUR).toISOString(),
        plannedRounds: 4000,
        ...fields,
      });
  }

  beforeAll(async () => {
    testApp = await createTestApp();
    scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-bookings-'));
    Object.assign(tokens, await demoTokens(testApp, ['dev', 'lucia', 'maren', 'ada']));
    fenLink = await setupId(testApp.app, tokens['dev'], 'Fen link');
    millLane = await setupId(testApp.app, tokens['dev'], 'Mill Lane bench');
  }, 60_000);
  afterAll(async () => {
    await testApp.close();
    fs.rmSync(scratch, { recursive: true, force: true });
  });

  describe('booking a night', () => {
    let booking: BookingDto;

    it('draws the seed on the server and shows only its SHA-256 commitment, in the answer, the mail to the shift leads and the trail', async () => {
      booking = (await book('dev', {}).expect(201)).body as BookingDto;
      expect(booking).toMatchObject({ setupId: fenLink, night: '2026-12-04', plannedRounds: 4000, profileName: 'Nightly standard', profileReason: '', seed: null, attempts: [] });
      expect(booking.seedCommitment).toMatch(/^[0-9a-f]{64}$/);
      await testApp.appMail.settled();
      const mail = await waitForMail(testApp.mailCatcher.inboxUrl, 'The night of 2026-12-04 on Fen link is booked');
      expect(mail.text).toContain(`Seed commitment: ${booking.seedCommitment}`);
      expect(mail.to.map((to) => to.address)).toContain('lucia.brandt@kestrelfen.example');
      const trail = (await request(testApp.app).get('/api/audit').query({ action: 'booking.created' }).set(bearer('maren')).expect(200)).body as { items: AuditEventDto[] };
      expect(trail.items[0].details).toMatchObject({ night: '2026-12-04', seedCommitment: booking.seedCommitment });
    });

    it('books a night once per setup', async () => {
      const response = await book('dev', {}).expect(409);
      expect((response.body as ApiErrorBody).error.message).toContain(`is booked already (booking ${booking.id})`);
    });

    it('lets only a shift lead or admin choose another profile, and only with a reason', async () => {
      const other = (await testApp.database.models.ProfileVersion.findOne({ where: { profileId: 2 } }))!;
      await book('dev', { night: '2026-12-05', profileVersionId: other.id, profileReason: 'looser tonight' }).expect(403);
      const noReason = await book('lucia', { night: '2026-12-05', profileVersionId: other.id }).expect(400);
      expect((noReason.body as ApiErrorBody).error.field).toBe('profileReason');
      const chosen = (
        await book('lucia', { night: '2026-12-05', profileVersionId: other.id, profileReason: 'Detector swap: the commissioning profile for one night.' }).expect(201)
      ).body as BookingDto;
      expect(chosen).toMatchObject({ profileVersionId: other.id, profileReason: 'Detector swap: the commissioning profile for one night.' });
    });

    it('refuses a window that opened more than an hour ago: a night is booked before acquisition', async () => {
      const response = await book('dev', { night: '2026-12-06', windowStart: new Date(Date.now() - 3 * HOUR).toISOString() }).expect(400);
      expect((response.body as ApiErrorBody).error.field).toBe('windowStart');
    });

    it('judges the night’s log with the committed seed and profile, then reveals the seed', async () => {
      const upload = (await uploadLog(testApp.app, tokens['dev'], await freshLog(), { setupId: fenLink, bookingId: booking.id }).expect(201)).body as RunDto;
      expect(upload.booking).toMatchObject({ bookingId: booking.id, attempt: 1, seedCommitment: booking.seedCommitment });
      expect(sha256(upload.seed)).toBe(booking.seedCommitment);
      expect(upload.acquiredOn).toBe('2026-12-04');
      const revealed = (await request(testApp.app).get(`/api/bookings/${booking.id}`).set(bearer('dev')).expect(200)).body as BookingDto;
      expect(revealed.seed).toBe(upload.seed);
      expect(revealed.attempts).toEqual([expect.objectContaining({ runId: upload.id, attempt: 1 })]);
    });

    it('takes a second log for the night only as a replacement with a reason: attempt 2, same seed and profile, the first run kept', async () => {
      const log = await freshLog();
      // Named by night rather than by booking: an upload cannot step around its night's booking.
      const refused = await uploadLog(testApp.app, tokens['dev'], log, { setupId: fenLink, acquiredOn: '2026-12-04' }).expect(400);
      expect((refused.body as ApiErrorBody).error).toMatchObject({ field: 'replacementReason' });
      expect((refused.body as ApiErrorBody).error.message).toContain('a replacement needs a reason');
      const replaced = (
        await uploadLog(testApp.app, tokens['dev'], log, { setupId: fenLink, acquiredOn: '2026-12-04', replacementReason: 'The first copy was cut short.' }).expect(201)
      ).body as RunDto;
      const first = (await request(testApp.app).get(`/api/runs/${replaced.booking!.attempts[0].runId}`).set(bearer('dev')).expect(200)).body as RunDto;
      expect(replaced.booking).toMatchObject({ attempt: 2, replacementReason: 'The first copy was cut short.' });
      expect(replaced.booking!.attempts.map((attempt) => attempt.attempt)).toEqual([1, 2]);
      expect(replaced.seed).toBe(first.seed);
      expect(replaced.profileVersionId).toBe(first.profileVersionId);
    });

    it('refuses the bytes of an earlier run for a booking, naming that run (a replay)', async () => {
      const log = await freshLog();
      const earlier = (await uploadLog(testApp.app, tokens['dev'], log, { setupId: millLane }).expect(201)).body as RunDto;
      const other = (await book('dev', { night: '2026-12-07' }).expect(201)).body as BookingDto;
      const response = await uploadLog(testApp.app, tokens['dev'], log, { setupId: fenLink, bookingId: other.id }).expect(409);
      expect((response.body as ApiErrorBody).error.message).toContain(`These bytes are already run ${earlier.id}`);
    });
  });

  describe('unbooked logs', () => {
    it('are accepted and marked unbooked; the same bytes under another night keep the seed and are flagged as a replay', async () => {
      const log = await freshLog();
      const first = (await uploadLog(testApp.app, tokens['dev'], log, { setupId: millLane, acquiredOn: '2026-11-20' }).expect(201)).body as RunDto;
      expect(first).toMatchObject({ booking: null, bookingId: null, attempt: null, replayOf: null });
      const again = (await uploadLog(testApp.app, tokens['dev'], log, { setupId: millLane, acquiredOn: '2026-11-21' }).expect(201)).body as RunDto;
      expect(again).toMatchObject({ replayOf: first.id, duplicateOf: first.id, seed: first.seed });
    });

    it('refuse a profile other than the setup’s', async () => {
      const response = await uploadLog(testApp.app, tokens['dev'], await freshLog(), { setupId: millLane, profileId: 1 }).expect(403);
      expect((response.body as ApiErrorBody).error.message).toContain('unbooked, are judged under the profile fixed for them');
    });
  });

  describe('upload tokens', () => {
    let created: CreatedUploadTokenDto;

    it('are made by the setup’s shift lead or an admin, shown once, and stored only as a hash', async () => {
      await request(testApp.app).post(`/api/setups/${fenLink}/upload-tokens`).set(bearer('dev')).send({ name: 'acq-pc', validDays: 30 }).expect(403);
      created = (
        await request(testApp.app).post(`/api/setups/${fenLink}/upload-tokens`).set(bearer('lucia')).send({ name: 'North Hall acquisition PC', validDays: 30 }).expect(201)
      ).body as CreatedUploadTokenDto;
      expect(created.token).toMatch(/^bkup_/);
      const stored = (await testApp.database.models.UploadToken.findByPk(created.id))!;
      expect(stored.tokenHash).toBe(sha256(created.token));
      const listed = (await request(testApp.app).get(`/api/setups/${fenLink}/upload-tokens`).set(bearer('maren')).expect(200)).body as UploadTokenDto[];
      expect(listed[0]).not.toHaveProperty('token');
    });

    it('upload to their setup, under the token’s name in the run and the trail', async () => {
      const run = (await uploadLog(testApp.app, created.token, await freshLog(), { setupId: fenLink, acquiredOn: '2026-11-28' }).expect(201)).body as RunDto;
      expect(run.uploadedBy).toBe('upload token “North Hall acquisition PC”');
      const trail = (await request(testApp.app).get(`/api/runs/${run.id}/trail`).set(bearer('dev')).expect(200)).body as AuditEventDto[];
      expect(trail[0]).toMatchObject({ action: 'run.uploaded', details: { uploadToken: 'North Hall acquisition PC' } });
      const listed = (await request(testApp.app).get(`/api/setups/${fenLink}/upload-tokens`).set(bearer('lucia')).expect(200)).body as UploadTokenDto[];
      expect(listed.find((token) => token.id === created.id)!.lastUsedAt).not.toBeNull();
    });

    it('do nothing else: another setup, any other route and sign-in all refuse them', async () => {
      await uploadLog(testApp.app, created.token, await freshLog(), { setupId: millLane }).expect(403);
      await request(testApp.app).get('/api/runs').set(bearer(created.token)).expect(401);
      await request(testApp.app).get(`/api/setups/${fenLink}/upload-tokens`).set(bearer(created.token)).expect(401);
      await request(testApp.app).post('/api/bookings').set(bearer(created.token)).send({}).expect(401);
      await request(testApp.app).post('/api/auth/login').send({ email: 'lucia.brandt@kestrelfen.example', password: created.token }).expect(401);
    });

    it('stop working when revoked or expired', async () => {
      // A body small enough to be sent whole before the 401 comes back (a big one races it: EPIPE).
      const refusedLog = { bytes: Buffer.from('round,x,y,a,b\n0,0,0,1,1\n'), name: 'night.csv' };
      const expiring = (await request(testApp.app).post(`/api/setups/${fenLink}/upload-tokens`).set(bearer('maren')).send({ name: 'spare', validDays: 1 }).expect(201))
        .body as CreatedUploadTokenDto;
      await testApp.database.models.UploadToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: expiring.id } });
      const expired = await uploadLog(testApp.app, expiring.token, refusedLog, { setupId: fenLink }).expect(401);
      expect((expired.body as ApiErrorBody).error.message).toContain('unknown, expired or revoked');

      await request(testApp.app).post(`/api/setups/${fenLink}/upload-tokens/${created.id}/revoke`).set(bearer('lucia')).expect(200);
      await uploadLog(testApp.app, created.token, refusedLog, { setupId: fenLink }).expect(401);
    });
  });

  describe('resumable uploads (tus)', () => {
    const tus = { 'Tus-Resumable': '1.0.0' };
    const metadata = (fields: Record<string, string>) =>
      Object.entries(fields)
        .map(([key, value]) => `${key} ${Buffer.from(value).toString('base64')}`)
        .join(',');

    it('refuse a replacement without a reason before a byte is sent', async () => {
      const response = await request(testApp.app)
        .post('/api/uploads')
        .set({ ...bearer('dev'), ...tus, 'Upload-Length': '100', 'Upload-Metadata': metadata({ filename: 'n.csv', setupId: String(fenLink), acquiredOn: '2026-12-04' }) })
        .expect(400);
      expect(JSON.parse(response.text)).toMatchObject({ error: { field: 'replacementReason' } });
    });

    it('go on after a cut connection and give the same archive entry as an uninterrupted upload', async () => {
      const log = await freshLog();
      const bytes = fs.readFileSync(log);
      const whole = (await uploadLog(testApp.app, tokens['dev'], log, { setupId: millLane, acquiredOn: '2026-11-25' }).expect(201)).body as RunDto;

      const server = testApp.app.listen(0, '127.0.0.1');
      await new Promise((resolve) => server.once('listening', resolve));
      const base = `http://127.0.0.1:${(server.address() as { port: number }).port}`;
      try {
        const created = await fetch(`${base}/api/uploads`, {
          method: 'POST',
          headers: {
            ...bearer('dev'),
            ...tus,
            'Upload-Length': String(bytes.length),
            'Upload-Metadata': metadata({ filename: 'night.csv', setupId: String(millLane), acquiredOn: '2026-11-25' }),
          },
        });
        expect(created.status).toBe(201);
        const location = new URL(created.headers.get('location')!, base).href;

        // Half the bytes, then the connection is cut with the request still promising the rest.
        const half = Math.floor(bytes.length / 2);
        const url = new URL(location);
        const patching = http.request({
          host: url.hostname,
          port: url.port,
          path: url.pathname,
          method: 'PATCH',
          headers: { ...bearer('dev'), ...tus, 'Upload-Offset': '0', 'Content-Type': 'application/offset+octet-stream', 'Content-Length': String(bytes.length) },
        });
        patching.on('error', () => undefined);
        await new Promise<void>((resolve) => patching.write(bytes.subarray(0, half), () => resolve()));
        await new Promise((resolve) => setTimeout(resolve, 300));
        patching.destroy();

        let offset = 0;
        for (let tries = 0; tries < 50 && offset === 0; tries++) {
          await new Promise((resolve) => setTimeout(resolve, 100));
          offset = Number((await fetch(location, { method: 'HEAD', headers: { ...bearer('dev'), ...tus } })).headers.get('upload-offset'));
        }
        expect(offset).toBeGreaterThan(0);
        expect(offset).toBeLessThan(bytes.length);
        // Someone else cannot see or go on with it.
        expect((await fetch(location, { method: 'HEAD', headers: { ...bearer('ada'), ...tus } })).status).toBe(404);

        const finished = await fetch(location, {
          method: 'PATCH',
          headers: { ...bearer('dev'), ...tus, 'Upload-Offset': String(offset), 'Content-Type': 'application/offset+octet-stream' },
          body: bytes.subarray(offset),
        });
        expect(finished.status).toBe(201);
        const run = (await finished.json()) as RunDto;
        expect(run.file).toEqual({ ...whole.file, originalName: 'night.csv' });
        expect(run.file.sha256).toBe(sha256(bytes));
        expect(run).toMatchObject({ duplicateOf: whole.id, seed: whole.seed });
        // Asking again for the finished upload gives the same run, never a second one.
        const asked = await fetch(location, { headers: bearer('dev') });
        expect(((await asked.json()) as RunDto).id).toBe(run.id);
      } finally {
        await new Promise((resolve) => server.close(resolve));
      }
    });
  });
});
