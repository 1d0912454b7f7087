import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { LedgerDto, RunDto, RunPageDto, WorklistDto } from '@shared/api';
import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';
import { writeModelLog } from '@fixtures/model-log-file';
import { fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';
import { demoTokens } from '../support/demo-tokens';
import { createTestApp, type TestApp } from '../support/test-app';

describe('the ledger of nights and the worklists', () => {
  let testApp: TestApp;
  const tokens: Record<string, string> = {};
  const bearer = (who: string) => ({ Authorization: `Bearer ${tokens[who]}` });
  let fenLink: number;
  let accepted: RunDto;
  let invalid: RunDto;

  beforeAll(async () => {
    testApp = await createTestApp();
    await testApp.startWorker();
    Object.assign(tokens, await demoTokens(testApp, ['dev', 'lucia', 'sami', 'ada']));
    fenLink = await setupId(testApp.app, tokens['dev'], 'Fen link');
    // The night of 1 December: a first log, replaced by a second; 2 December: a log with no rounds.
    await waitForFinishedRun(
      testApp.app,
      tokens['dev'],
      ((await uploadLog(testApp.app, tokens['dev'], fixtureLog('aborted-low-chsh.csv'), { setupId: fenLink, acquiredOn: '2026-12-01' }).expect(201)).body as RunDto).id,
    );
    const second = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('accepted-run.csv'), { setupId: fenLink, acquiredOn: '2026-12-01' }).expect(201)).body as RunDto;
    accepted = await waitForFinishedRun(testApp.app, tokens['dev'], second.id);
    const empty = (await uploadLog(testApp.app, tokens['dev'], fixtureLog('header-only.csv'), { setupId: fenLink, acquiredOn: '2026-12-02' }).expect(201)).body as RunDto;
    invalid = await waitForFinishedRun(testApp.app, tokens['dev'], empty.id);
  }, 120_000);
  afterAll(() => testApp.close());

  const ledger = async (query: string) => (await request(testApp.app).get(`/api/ledger${query}`).set(bearer('sami')).expect(200)).body as LedgerDto;
  const worklist = async (who: string) => (await request(testApp.app).get('/api/worklist').set(bearer(who)).expect(200)).body as WorklistDto;

  it('shows each setup once, with the latest log of each night, its attempts and its sign-off', async () => {
    const shown = await ledger('?from=2026-11-30&to=2026-12-03');
    expect(shown).toMatchObject({ from: '2026-11-30', to: '2026-12-03' });
    expect(shown.setups.map((setup) => setup.name)).toEqual(['Fen link', 'Mill Lane bench']);
    const fen = shown.setups.find((setup) => setup.setupId === fenLink)!;
    expect(fen.cells).toEqual([
      {
        night: '2026-12-01',
        bookingId: null,
        attempts: 2,
        run: { id: accepted.id, state: 'accepted', verdict: 'ACCEPT', signedOff: false, decision: null, withdrawn: false },
        waitingFor: null,
      },
      {
        night: '2026-12-02',
        bookingId: null,
        attempts: 1,
        run: { id: invalid.id, state: 'invalid', verdict: 'INVALID', signedOff: false, decision: null, withdrawn: false },
        waitingFor: null,
      },
    ]);

    await request(testApp.app).post(`/api/runs/${accepted.id}/sign-off`).set(bearer('lucia')).send({ decision: 'key-discarded', comment: 'Too short for a key.' }).expect(201);
    expect((await ledger('?from=2026-12-01&to=2026-12-01')).setups.find((setup) => setup.setupId === fenLink)!.cells[0].run).toMatchObject({
      signedOff: true,
      decision: 'key-discarded',
    });
  });

  it('takes the last three weeks by default and refuses a reversed or too long range, naming it', async () => {
    const shown = await ledger('');
    expect((Date.parse(shown.to) - Date.parse(shown.from)) / 86_400_000).toBe(20);
    const reversed = await request(testApp.app).get('/api/ledger?from=2026-12-05&to=2026-12-01').set(bearer('sami')).expect(400);
    expect(reversed.body).toMatchObject({ error: { field: 'from', message: 'from (2026-12-05) is after to (2026-12-01)' } });
    const long = await request(testApp.app).get('/api/ledger?from=2026-01-01&to=2026-12-01').set(bearer('sami')).expect(400);
    expect(long.body).toMatchObject({ error: { field: 'to', message: 'the ledger shows 92 nights at most; 2026-01-01 to 2026-12-01 is 335' } });
  });

  it("gives each person the lists of their roles: a shift lead's sign-offs (not their own uploads under four eyes), an uploader's runs without a verdict", async () => {
    const lucia = await worklist('lucia');
    expect(lucia.lists.map((list) => list.kind)).toEqual(['sign-off']);
    expect(lucia.lists[0].items.map((item) => item.runId)).toContain(invalid.id);
    expect(lucia.lists[0].items.map((item) => item.runId)).not.toContain(accepted.id);

    const dev = await worklist('dev');
    expect(dev.lists.map((list) => list.kind)).toEqual(['uploads']);
    expect(dev.lists[0].items).toContainEqual({
      runId: invalid.id,
      setupName: 'Fen link',
      night: '2026-12-02',
      state: 'invalid',
      verdict: 'INVALID',
      note: 'no verdict was possible',
    });

    // Ada leads the Fen link and uploads too: her own upload is not on her sign-off list.
    const own = (await uploadLog(testApp.app, tokens['ada'], fixtureLog('accepted-run.csv'), { setupId: fenLink, acquiredOn: '2026-12-03' }).expect(201)).body as RunDto;
    await waitForFinishedRun(testApp.app, tokens['ada'], own.id);
    const ada = await worklist('ada');
    expect(ada.lists.map((list) => list.kind)).toEqual(['sign-off', 'uploads']);
    expect(ada.lists[0].items.map((item) => item.runId)).not.toContain(own.id);
    expect((await worklist('lucia')).lists[0].items.map((item) => item.runId)).toContain(own.id);

    const sami = await worklist('sami');
    expect(sami.lists).toEqual([{ kind: 'reverifications', count: 0, items: [] }]);
    await request(testApp.app).post(`/api/runs/${accepted.id}/reverifications`).set(bearer('sami')).send({}).expect(201);
    expect((await worklist('sami')).lists[0]).toMatchObject({ count: 1, items: [{ runId: accepted.id }] });
  }, 60_000);

  it('counts a replaced log of a booked night as no longer awaiting sign-off: its replacement is', async () => {
    const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-ledger-'));
    const log = async (n: number) => {
      const file = path.join(scratch, `night-${n}.csv`);
      await writeModelLog(file, { ...steadyPair, rounds: 4000 }, FIXTURE_SEED.slice(0, 56) + n.toString(16).padStart(8, '0'));
      return file;
    };
    const now = Date.now();
    const booking = (
      await request(testApp.app)
        .post('/api/bookings')
        .set(bearer('dev'))
        .send({ setupId: fenLink, night: '2026-11-20', windowStart: new Date(now - 60_000).toISOString(), windowEnd: new Date(now + 3_600_000).toISOString(), plannedRounds: 4000 })
        .expect(201)
    ).body as { id: number };
    const upload = async (n: number, fields: Record<string, string | number>) =>
      waitForFinishedRun(testApp.app, tokens['dev'], ((await uploadLog(testApp.app, tokens['dev'], await log(n), { setupId: fenLink, ...fields }).expect(201)).body as RunDto).id);
    const first = await upload(1, { bookingId: booking.id });
    const second = await upload(2, { bookingId: booking.id, replacementReason: 'The first copy was cut short.' });
    fs.rmSync(scratch, { recursive: true, force: true });

    const awaiting = (await request(testApp.app).get('/api/runs').query({ awaitingSignOff: 'true', pageSize: 200 }).set(bearer('sami')).expect(200)).body as RunPageDto;
    expect(awaiting.items.map((run) => run.id)).toContain(second.id);
    expect(awaiting.items.map((run) => run.id)).not.toContain(first.id);
    const signOffs = (await worklist('lucia')).lists[0].items.map((item) => item.runId);
    expect(signOffs).toContain(second.id);
    expect(signOffs).not.toContain(first.id);
    const night = (await ledger('?from=2026-11-20&to=2026-11-20')).setups.find((setup) => setup.setupId === fenLink)!.cells[0];
    expect(night).toMatchObject({ bookingId: booking.id, attempts: 2, run: { id: second.id } });
  }, 60_000);

  it('lists the runs awaiting sign-off', async () => {
    const page = (await request(testApp.app).get('/api/runs').query({ awaitingSignOff: 'true', setupId: fenLink, pageSize: 200 }).set(bearer('sami')).expect(200))
      .body as RunPageDto;
    expect(page.items.every((run) => !run.signedOff && run.verdict !== null)).toBe(true);
    expect(page.items.map((run) => run.id)).toContain(invalid.id);
    expect(page.items.map((run) => run.id)).not.toContain(accepted.id);
  });
});
