import { Readable } from 'node:stream';
import request from 'supertest';
import { analyseStationPair } from '@shared/analysis/node';
import type { ApiErrorBody, AuditEventDto, CreatedUploadTokenDto, LedgerDto, RunDto, SetupDto, StationLogDto } from '@shared/api';
import type { Station } from '@shared/analysis/stations/station-columns';
import { stationCsvBytes } from '@fixtures/stations/station-csv';
import { KESTREL_FEN_TIMING, STATION_PAIR_SEED, stationRecord, type StationPairOptions } from '@fixtures/stations/station-pair';
import { stationPairOptions } from '@server/runs/station-pair-record';
import { demoTokens } from '../support/demo-tokens';
import { createResumableUpload, patchUpload } from '../support/resumable-api';
import { bookOpenNight, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

/** Rounds of each generated night: enough for the alignment check to see a shift clearly. */
const ROUNDS = 60_000;

/** Both station logs of a generated night, as uploads. */
function stationPair(name: string, options: Omit<StationPairOptions, 'rounds'> = {}, seed = STATION_PAIR_SEED): Record<Station, { bytes: Buffer; name: string }> {
  const log = (station: Station) => ({
    bytes: Buffer.from(stationCsvBytes(station, stationRecord(station, { rounds: ROUNDS, ...options }, seed))),
    name: `${name}-${station.toLowerCase()}.csv`,
  });
  return { A: log('A'), B: log('B') };
}

describe('two station logs of a night, uploaded one at a time and joined into one run', () => {
  let testApp: TestApp;
  let tokens: Record<string, string>;
  const bearer = (who: string) => ({ Authorization: `Bearer ${tokens[who]}` });
  let fenLink: number;
  let fen: SetupDto;

  beforeAll(async () => {
    testApp = await createTestApp();
    tokens = await demoTokens(testApp, ['dev', 'lucia', 'sami', 'maren']);
    fenLink = await setupId(testApp.app, tokens['dev'], 'Fen link');
    const current = (await request(testApp.app).get(`/api/setups/${fenLink}`).set(bearer('maren')).expect(200)).body as SetupDto;
    fen = (
      await request(testApp.app)
        .put(`/api/setups/${fenLink}`)
        .set(bearer('maren'))
        .send({
          name: current.name,
          stationALabel: current.stationALabel,
          stationBLabel: current.stationBLabel,
          defaultProfileId: current.defaultProfileId,
          shiftLeadIds: current.shiftLeads.map((lead) => lead.id),
          ...KESTREL_FEN_TIMING.geometry,
        })
        .expect(200)
    ).body as SetupDto;
    await testApp.startWorker();
  }, 120_000);
  afterAll(() => testApp.close());

  const upload = (who: string, file: { bytes: Buffer; name: string }, fields: Record<string, string | number>) =>
    uploadLog(testApp.app, tokens[who] ?? who, file, { setupId: fenLink, ...fields });
  const trailOfSetup = async () =>
    (await request(testApp.app).get(`/api/audit?targetType=setup&targetId=${fenLink}&pageSize=200`).set(bearer('sami')).expect(200)).body as { items: AuditEventDto[] };

  it('waits for the other station, then analyses the pair exactly as the engine does on the same two files', async () => {
    const pair = stationPair('aligned');
    const sendB = () => upload('dev', pair.B, { station: 'B', acquiredOn: '2026-11-20' }).set('Idempotency-Key', 'fen-b-2026-11-20');
    const first = await sendB().expect(202);
    const waiting = first.body as StationLogDto;
    // A repeat of the upload (its answer lost) is told of the same waiting log, not a second one.
    expect((await sendB().expect(202)).body).toEqual(waiting);
    expect(waiting).toMatchObject({
      station: 'B',
      setupId: fenLink,
      acquiredOn: '2026-11-20',
      bookingId: null,
      runId: null,
      originalName: 'aligned-b.csv',
      uploadedBy: 'Dev Okafor',
    });
    const listed = (await request(testApp.app).get(`/api/runs/station-logs?setupId=${fenLink}&waiting=true`).set(bearer('sami')).expect(200)).body as StationLogDto[];
    const ledger = (await request(testApp.app).get('/api/ledger?from=2026-11-20&to=2026-11-20').set(bearer('sami')).expect(200)).body as LedgerDto;
    expect(ledger.setups.find((setup) => setup.setupId === fenLink)!.cells).toEqual([{ night: '2026-11-20', bookingId: null, attempts: 0, run: null, waitingFor: 'A' }]);
    expect(listed.map((log) => log.id)).toContain(waiting.id);

    const made = (await upload('dev', pair.A, { station: 'A', acquiredOn: '2026-11-20' }).expect(201)).body as RunDto;
    expect(made).toMatchObject({
      stationPair: true,
      file: { originalName: 'aligned-a.csv' },
      stations: { stationB: { originalName: 'aligned-b.csv' }, offset: null, geometry: KESTREL_FEN_TIMING.geometry },
    });
    const run = await waitForFinishedRun(testApp.app, tokens['dev'], made.id, 60_000);

    // The same two files through the engine directly, with what the run recorded, give the same result digest.
    const profile = (await request(testApp.app).get(`/api/profiles/${fen.defaultProfileId}`).set(bearer('sami')).expect(200)).body as {
      versions: { id: number; parameters: unknown }[];
    };
    const parameters = profile.versions.find((version) => version.id === run.profileVersionId)!.parameters;
    const memory = (bytes: Buffer) => ({ open: () => Readable.from([bytes]), bytes: bytes.length });
    const direct = await analyseStationPair(
      memory(pair.A.bytes),
      memory(pair.B.bytes),
      stationPairOptions({ fileSha256: run.file.sha256, mapping: run.mapping, seed: run.seed, stations: run.stations! }, parameters),
    );
    expect(run.result!.fingerprint).toBe(direct.fingerprint);
    expect(run.result!.stations!.alignment).toMatchObject({ shifted: false, centre: 0 });
    expect(run.result!.stations!.timing).not.toBeNull();
    expect(run.verdict).not.toBe('INVALID');
    // The repeat now tells that the log is joined into the run.
    expect((await sendB().expect(202)).body).toMatchObject({ id: waiting.id, runId: run.id });

    const logs = (await request(testApp.app).get(`/api/runs/station-logs?setupId=${fenLink}`).set(bearer('sami')).expect(200)).body as StationLogDto[];
    expect(
      logs
        .filter((log) => log.runId === run.id)
        .map((log) => log.station)
        .sort(),
    ).toEqual(['A', 'B']);
    const verification = (await request(testApp.app).get(`/api/runs/${run.id}/verification`).set(bearer('sami')).expect(200)).body as {
      intact: boolean;
      checks: { check: string }[];
    };
    expect(verification.intact).toBe(true);
    expect(verification.checks.filter((check) => check.check === 'archive-file')).toHaveLength(2);
  }, 120_000);

  it('catches a shifted pair with its offset named, and a shift lead re-runs it at the stated offset with a reason', async () => {
    const pair = stationPair('shifted', { shiftB: 3 }, '11'.repeat(32));
    await upload('dev', pair.A, { station: 'A', acquiredOn: '2026-11-21' }).expect(202);
    const shiftedRun = await waitForFinishedRun(
      testApp.app,
      tokens['dev'],
      ((await upload('dev', pair.B, { station: 'B', acquiredOn: '2026-11-21' }).expect(201)).body as RunDto).id,
      60_000,
    );
    expect(shiftedRun.verdict).toBe('INVALID');
    expect(shiftedRun.result!.stations!.alignment).toMatchObject({ shifted: true, bestOffset: 3 });
    expect(shiftedRun.result!.reasons[0]).toMatch(/3 rounds/);

    const realign = (who: string, body: object) => request(testApp.app).post(`/api/runs/${shiftedRun.id}/realign`).set(bearer(who)).send(body);
    await realign('dev', { offset: 3, reason: 'B’s buffer started late.' }).expect(403);
    expect(((await realign('lucia', { offset: 3, reason: '  ' }).expect(400)).body as ApiErrorBody).error.field).toBe('reason');
    expect(((await realign('lucia', { offset: 17, reason: 'Far.' }).expect(400)).body as ApiErrorBody).error.field).toBe('offset');
    expect(((await realign('lucia', { offset: 0, reason: 'Again as written.' }).expect(400)).body as ApiErrorBody).error.field).toBe('offset');

    const rerun = (await realign('lucia', { offset: 3, reason: 'Station B’s buffer started three triggers late (log book, 21 Nov).' }).expect(201)).body as RunDto;
    expect(rerun).toMatchObject({ seed: shiftedRun.seed, profileVersionId: shiftedRun.profileVersionId, stations: { offset: 3, realignedFrom: shiftedRun.id } });
    const realigned = await waitForFinishedRun(testApp.app, tokens['dev'], rerun.id, 60_000);
    expect(realigned.result!.stations!.alignment).toMatchObject({ centre: 3, shifted: false });
    expect(realigned.verdict).not.toBe('INVALID');
    const trail = (await request(testApp.app).get(`/api/runs/${rerun.id}/trail`).set(bearer('sami')).expect(200)).body as AuditEventDto[];
    expect(trail.find((event) => event.action === 'run.realigned')).toMatchObject({ actor: 'Lucia Brandt', details: { realignedFrom: shiftedRun.id, offset: 3 } });

    const joined = (await upload('dev', { bytes: Buffer.from('round,x,y,a,b\n0,0,0,0,0\n'), name: 'joined.csv' }, { acquiredOn: '2026-11-22' }).expect(201)).body as RunDto;
    await request(testApp.app).post(`/api/runs/${joined.id}/realign`).set(bearer('lucia')).send({ offset: 1, reason: 'No.' }).expect(409);
  }, 180_000);

  it('a station’s upload token sends its own station’s log only', async () => {
    const created = (
      await request(testApp.app).post(`/api/setups/${fenLink}/upload-tokens`).set(bearer('lucia')).send({ name: 'Mill Lane computer', validDays: 7, station: 'B' }).expect(201)
    ).body as CreatedUploadTokenDto;
    expect(created.station).toBe('B');
    const pair = stationPair('token', {}, '22'.repeat(32));
    await upload(created.token, pair.B, { acquiredOn: '2026-11-23' }).expect(403);
    await upload(created.token, pair.A, { station: 'A', acquiredOn: '2026-11-23' }).expect(403);
    const waiting = (await upload(created.token, pair.B, { station: 'B', acquiredOn: '2026-11-23' }).expect(202)).body as StationLogDto;
    expect(waiting.uploadedBy).toBe('upload token “Mill Lane computer”');
  });

  it('refuses what cannot pair: no night, a mapping of columns, one file as both stations; a later log of a station replaces the waiting one', async () => {
    const pair = stationPair('refused', {}, '33'.repeat(32));
    expect(((await upload('dev', pair.A, { station: 'A' }).expect(400)).body as ApiErrorBody).error.field).toBe('acquiredOn');
    const mapping = JSON.stringify({ columns: { x: 'setting' } });
    expect(((await upload('dev', pair.A, { station: 'A', acquiredOn: '2026-11-24', mapping }).expect(400)).body as ApiErrorBody).error.field).toBe('mapping');
    expect(((await upload('dev', pair.A, { station: 'Z', acquiredOn: '2026-11-24' }).expect(400)).body as ApiErrorBody).error.field).toBe('station');

    const firstA = (await upload('dev', pair.A, { station: 'A', acquiredOn: '2026-11-24' }).expect(202)).body as StationLogDto;
    expect(((await upload('dev', pair.A, { station: 'B', acquiredOn: '2026-11-24' }).expect(400)).body as ApiErrorBody).error.field).toBe('station');
    const other = stationPair('replacement', {}, '44'.repeat(32));
    const secondA = (await upload('dev', other.A, { station: 'A', acquiredOn: '2026-11-24' }).expect(202)).body as StationLogDto;
    const made = (await upload('dev', other.B, { station: 'B', acquiredOn: '2026-11-24' }).expect(201)).body as RunDto;
    expect(made.file.sha256).toBe(secondA.sha256);
    const logs = (await request(testApp.app).get(`/api/runs/station-logs?setupId=${fenLink}`).set(bearer('sami')).expect(200)).body as StationLogDto[];
    expect(logs.find((log) => log.id === firstA.id)).toMatchObject({ supersededBy: secondA.id, runId: null });
    const trail = await trailOfSetup();
    expect(trail.items.find((event) => event.action === 'station-log.uploaded' && event.details['stationLogId'] === secondA.id)).toMatchObject({
      details: { supersedes: firstA.id, station: 'A' },
    });
  }, 60_000);

  it('a booked night waits for both stations’ logs, sent as resumable uploads, and is judged under the booking’s seed', async () => {
    const booking = await bookOpenNight(testApp.app, tokens['dev'], { setupId: fenLink, night: '2026-12-05', plannedRounds: ROUNDS });
    const pair = stationPair('booked', {}, '55'.repeat(32));
    const resumable = async (station: Station) => {
      const location = await createResumableUpload(testApp.app, tokens['dev'], pair[station].bytes.length, {
        setupId: fenLink,
        bookingId: booking.id,
        station,
        filename: pair[station].name,
      });
      const answer = await patchUpload(testApp.app, tokens['dev'], location, 0, pair[station].bytes);
      return { location, status: answer.status, body: JSON.parse(answer.text) as unknown };
    };
    const first = await resumable('A');
    expect(first.status).toBe(202);
    const waiting = first.body as StationLogDto;
    expect(waiting).toMatchObject({ station: 'A', bookingId: booking.id, acquiredOn: null, runId: null });
    // A client whose last answer was lost asks what its finished upload made: the waiting log.
    expect((await request(testApp.app).get(first.location).set(bearer('dev')).expect(202)).body).toEqual(waiting);
    const second = await resumable('B');
    expect(second.status).toBe(201);
    const made = second.body as RunDto;
    expect(made).toMatchObject({ bookingId: booking.id, attempt: 1, stationPair: true, stations: { stationB: { originalName: 'booked-b.csv' } } });
    const run = await waitForFinishedRun(testApp.app, tokens['dev'], made.id, 60_000);
    expect(run.booking).toMatchObject({ bookingId: booking.id, seedCommitment: booking.seedCommitment });
    expect(run.result!.stations!.files.map((file) => file.sha256)).toEqual([run.file.sha256, run.stations!.stationB.sha256]);
  }, 90_000);
});
