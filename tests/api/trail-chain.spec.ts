import { QueryTypes, type Transaction } from 'sequelize';
import request from 'supertest';
import { TRAIL_CHECK_PROBLEM_LIMIT, type AuditEventDto, type RunDto, type TrailCheckDto, type VerificationDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import type { AuditEntry } from '@server/audit/audit-trail';
import { fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

jest.setTimeout(120_000);

interface LinkRow {
  seq: number;
  event_id: number;
}

describe('the system trail’s hash chain', () => {
  let testApp: TestApp;
  let sami: string;
  let dev: string;

  const sql = (statement: string, replacements: Record<string, unknown> = {}) => testApp.database.sequelize.query(statement, { replacements });
  const rows = <T extends object>(statement: string, replacements: Record<string, unknown> = {}) =>
    testApp.database.sequelize.query<T>(statement, { replacements, type: QueryTypes.SELECT });
  /** What an intruder with the database owner's rights does: switch the append-only triggers off, write, switch them on. */
  const tamper = (statement: string, replacements: Record<string, unknown> = {}) =>
    sql(
      `ALTER TABLE audit_events DISABLE TRIGGER audit_events_append_only; ALTER TABLE audit_chain_links DISABLE TRIGGER audit_chain_links_append_only;
       ${statement};
       ALTER TABLE audit_events ENABLE TRIGGER audit_events_append_only; ALTER TABLE audit_chain_links ENABLE TRIGGER audit_chain_links_append_only`,
      replacements,
    );
  const trailCheck = async () => (await request(testApp.app).get('/api/audit/trail-check').set('Authorization', `Bearer ${sami}`).expect(200)).body as TrailCheckDto;
  const verification = async (runId: number) =>
    (await request(testApp.app).get(`/api/runs/${runId}/verification`).set('Authorization', `Bearer ${sami}`).expect(200)).body as VerificationDto;
  const trailCheckOf = (result: VerificationDto) => result.checks.find((check) => check.check === 'system-trail')!;
  const linkOf = async (eventId: number) => (await rows<LinkRow>('SELECT seq::int, event_id::int FROM audit_chain_links WHERE event_id = :eventId', { eventId }))[0];
  const newestLink = async () => (await rows<LinkRow>('SELECT seq::int, event_id::int FROM audit_chain_links ORDER BY seq DESC LIMIT 1'))[0];
  const eventCount = async () => (await rows<{ count: number }>('SELECT count(*)::int AS count FROM audit_events'))[0].count;
  const entry = (targetId: string): AuditEntry => ({ actorId: null, action: 'setup.changed', targetType: 'setup', targetId, details: { note: 'trail chain test' } });

  /** The run's analysis, mail and every line the worker writes about it are in the trail. */
  async function waitForQuietRun(runId: number): Promise<void> {
    const deadline = Date.now() + 30_000;
    for (;;) {
      const trail = (await request(testApp.app).get(`/api/runs/${runId}/trail`).set('Authorization', `Bearer ${sami}`).expect(200)).body as AuditEventDto[];
      if (trail.some((event) => event.action === 'run.mail-sent' || event.action === 'run.mail-skipped')) return;
      if (Date.now() > deadline) throw new Error(`Run ${runId} has no mail line after 30 s`);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }

  beforeAll(async () => {
    testApp = await createTestApp();
    sami = await testApp.signIn('sami.virtanen@kestrelfen.example', DEMO_PASSWORD);
    dev = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
  }, 60_000);
  afterAll(() => testApp.close());

  it('links every event, 20 recorded at once among crossing row locks included, and finds the chain intact', async () => {
    const { sequelize } = testApp.database;
    const before = await trailCheck();
    expect(before).toMatchObject({ intact: true, problems: [], problemCount: 0, events: await eventCount() });
    expect(before.events).toBeGreaterThan(0);

    // Half record and then lock a shared row, half lock it and then record. Were the head taken
    // when the event is written rather than at commit, these would deadlock.
    const fenLink = await setupId(testApp.app, sami, 'Fen link');
    const lockSetup = (transaction: Transaction) => sequelize.query('SELECT id FROM setups WHERE id = :id FOR UPDATE', { replacements: { id: fenLink }, transaction });
    await Promise.all(
      Array.from({ length: 20 }, (_, index) =>
        sequelize.transaction(async (transaction) => {
          if (index % 2 === 0) await lockSetup(transaction);
          await testApp.services.audit.record(entry(`concurrent-${index}`), transaction);
          if (index % 2 === 1) await lockSetup(transaction);
        }),
      ),
    );

    const after = await trailCheck();
    expect(after).toMatchObject({ intact: true, problems: [], problemCount: 0, events: before.events + 20 });
    const [chain] = await rows<{ links: number; first: number; last: number }>(
      'SELECT count(*)::int AS links, min(seq)::int AS first, max(seq)::int AS last FROM audit_chain_links',
    );
    expect(chain).toEqual({ links: after.events, first: 1, last: after.events });
    const { hash, ...head } = after.head!;
    expect(head).toEqual({ seq: after.events });
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it('a rolled-back event never gets a link, so seq runs on without a gap', async () => {
    const { sequelize } = testApp.database;
    const { seq: lastSeq, event_id: lastEventId } = await newestLink();
    await expect(
      sequelize.transaction(async (transaction) => {
        await testApp.services.audit.record(entry('rolled-back'), transaction);
        throw new Error('changed our mind');
      }),
    ).rejects.toThrow('changed our mind');
    await testApp.services.audit.record(entry('after-the-roll-back'));

    const next = await newestLink();
    // The event ids skip the rolled-back one; the links do not.
    expect(next.event_id).toBeGreaterThan(lastEventId + 1);
    expect(next.seq).toBe(lastSeq + 1);
    expect(await rows('SELECT 1 FROM audit_events WHERE target_id = :id', { id: 'rolled-back' })).toHaveLength(0);
    expect((await trailCheck()).intact).toBe(true);
  });

  it('the database refuses to change or remove a link, and moves the head only forward onto a new link', async () => {
    await expect(sql("UPDATE audit_chain_links SET hash = repeat('0', 64) WHERE seq = 1")).rejects.toThrow(/append-only/);
    await expect(sql('DELETE FROM audit_chain_links WHERE seq = 1')).rejects.toThrow(/append-only/);
    await expect(sql('TRUNCATE audit_chain_links')).rejects.toThrow(/append-only/);
    await expect(sql('UPDATE audit_chain_head SET seq = seq - 1')).rejects.toThrow(/only moves forward/);
    await expect(sql('DELETE FROM audit_chain_head')).rejects.toThrow(/only moves forward/);
    expect((await trailCheck()).intact).toBe(true);
  });

  let runId: number;
  let removedLine: string;

  it('a removed event row is named, and fails the trail check of every run verification', async () => {
    await testApp.startWorker();
    const created = await uploadLog(testApp.app, dev, fixtureLog('accepted-run.csv'), { setupId: await setupId(testApp.app, dev, 'Fen link') }).expect(201);
    runId = (await waitForFinishedRun(testApp.app, sami, (created.body as RunDto).id)).id;
    await waitForQuietRun(runId);
    const intact = await verification(runId);
    expect(intact.checks.map((check) => [check.check, check.passed])).toEqual([
      ['result-fingerprint', true],
      ['signature', true],
      ['archive-file', true],
      ['system-trail', true],
    ]);
    expect(trailCheckOf(intact).detail).toBe(`The system trail’s hash chain holds: all ${await eventCount()} events are linked in order and each still hashes to its link.`);

    const [uploaded] = await rows<{ id: number }>("SELECT id::int FROM audit_events WHERE action = 'run.uploaded' AND target_id = :runId", { runId: String(runId) });
    const { seq } = await linkOf(uploaded.id);
    await tamper('DELETE FROM audit_events WHERE id = :id', { id: uploaded.id });

    removedLine = `Link ${seq} records event ${uploaded.id}, which is no longer in the trail: the event’s row was removed.`;
    expect(await trailCheck()).toMatchObject({ intact: false, problems: [removedLine], problemCount: 1 });
    const broken = await verification(runId);
    expect(broken.intact).toBe(false);
    expect(trailCheckOf(broken)).toEqual({ check: 'system-trail', passed: false, detail: `The system trail’s hash chain is broken. ${removedLine}` });
    expect(broken.checks.filter((check) => check.check !== 'system-trail').every((check) => check.passed)).toBe(true);
  });

  let changedLine: string;

  it('a changed field of an event is named by its link', async () => {
    const [finished] = await rows<{ id: number }>("SELECT id::int FROM audit_events WHERE action = 'run.finished' AND target_id = :runId", { runId: String(runId) });
    const { seq } = await linkOf(finished.id);
    await tamper(`UPDATE audit_events SET details = jsonb_set(details, '{verdict}', '"ABORT"') WHERE id = :id`, { id: finished.id });

    changedLine = `Event ${finished.id} no longer hashes to link ${seq}: a field of the event was changed after it was recorded.`;
    // In chain order: the upload's link comes before the verdict's.
    expect(await trailCheck()).toMatchObject({ intact: false, problems: [removedLine, changedLine], problemCount: 2 });
    expect(trailCheckOf(await verification(runId)).detail).toBe(`The system trail’s hash chain is broken. ${removedLine} 1 more problem is listed under Audit, System trail.`);
  });

  it('events written with the chain’s trigger off are named, at most 20 of them listed', async () => {
    await sql(
      `ALTER TABLE audit_events DISABLE TRIGGER audit_events_chained;
       INSERT INTO audit_events (actor_id, action, target_type, target_id) SELECT NULL, 'setup.changed', 'setup', 'slipped-in-' || n FROM generate_series(1, 25) n;
       ALTER TABLE audit_events ENABLE TRIGGER audit_events_chained`,
    );
    const slipped = await rows<{ id: number }>("SELECT id::int FROM audit_events WHERE target_id LIKE 'slipped-in-%' ORDER BY id");
    expect(slipped).toHaveLength(25);

    const check = await trailCheck();
    expect(check).toMatchObject({ intact: false, problemCount: 27 });
    expect(check.problems).toHaveLength(TRAIL_CHECK_PROBLEM_LIMIT);
    expect(check.problems).toEqual([
      removedLine,
      changedLine,
      ...slipped.slice(0, TRAIL_CHECK_PROBLEM_LIMIT - 2).map(({ id }) => `Event ${id} has no link in the chain: it was written while the chain’s trigger was switched off.`),
    ]);
  });

  it('removing the newest event with its link is caught by the head, and by a gap once the chain grows past it', async () => {
    const newest = await newestLink();
    await tamper('DELETE FROM audit_chain_links WHERE seq = :seq; DELETE FROM audit_events WHERE id = :id', { seq: newest.seq, id: newest.event_id });

    const headLine = `The chain’s head is at link ${newest.seq}, but the last link is ${newest.seq - 1}: the newest link and its event were removed.`;
    const cut = await trailCheck();
    expect(cut.problems.slice(0, 3)).toEqual([removedLine, changedLine, headLine]);
    const { hash, ...head } = cut.head!;
    expect(head).toEqual({ seq: newest.seq });
    expect(hash).toMatch(/^[0-9a-f]{64}$/);

    await testApp.services.audit.record(entry('after-the-cut'));
    const grown = await newestLink();
    const gapLine = `Link ${newest.seq} is missing before link ${grown.seq} (event ${grown.event_id}): a link and its event were removed.`;
    expect((await trailCheck()).problems.slice(0, 3)).toEqual([removedLine, changedLine, gapLine]);
  });
});
