import { execFileSync, spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { canonicalJson } from '@shared/analysis/canonical-json';
import { resultFingerprint } from '@shared/analysis/node';
import type { AnalysisResult } from '@shared/analysis/result';
import type { AuditPageDto, FieldDifference, ReverificationDto, RunDto, RunReportDto, SigningKeyDto, VerificationDto } from '@shared/api';
import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';
import { writeModelLog } from '@fixtures/model-log-file';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { PROJECT_ROOT } from '@server/config/config';
import { signingKeyFromPem } from '@server/integrity/signing-key';
import { createSigningKeysService } from '@server/integrity/signing-keys.service';
import { createLocalLogStore } from '@server/storage/local-log-store';
import { createTestApp, type TestApp } from '../support/test-app';
import { bookOpenNight, fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';

/** Runs `npm run --silent verify -- ...` as a user would. */
function runVerify(...args: string[]) {
  const run = spawnSync(path.join(PROJECT_ROOT, 'node_modules/.bin/tsx'), [path.join(PROJECT_ROOT, 'server/cli/verify.ts'), ...args], { cwd: PROJECT_ROOT, encoding: 'utf8' });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe('signed results, integrity checks, re-verification and exports', () => {
  let testApp: TestApp;
  let scratch: string;
  const tokens: Record<string, string> = {};
  const bearer = (who: string) => ({ Authorization: `Bearer ${tokens[who]}` });
  let fenLink: number;

  const analysed = async (fixture: string) => {
    const created = await uploadLog(testApp.app, tokens['dev'], fixtureLog(fixture), { setupId: fenLink }).expect(201);
    return waitForFinishedRun(testApp.app, tokens['sami'], (created.body as RunDto).id);
  };
  const verification = async (runId: number) => (await request(testApp.app).get(`/api/runs/${runId}/verification`).set(bearer('sami')).expect(200)).body as VerificationDto;
  const checkOf = (result: VerificationDto, check: string) => result.checks.find((item) => item.check === check)!;
  const sql = (statement: string, replacements: Record<string, unknown> = {}) => testApp.database.sequelize.query(statement, { replacements });
  /** What an intruder with the database owner's rights does: switch the guarding trigger off, write, switch it on. */
  const tamperRun = (runId: number, assignment: string, replacements: Record<string, unknown> = {}) =>
    sql(`ALTER TABLE runs DISABLE TRIGGER runs_signed_result_fixed; UPDATE runs SET ${assignment} WHERE id = :runId; ALTER TABLE runs ENABLE TRIGGER runs_signed_result_fixed`, {
      ...replacements,
      runId,
    });

  beforeAll(async () => {
    testApp = await createTestApp();
    await testApp.startWorker();
    scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-integrity-'));
    for (const [who, email] of Object.entries({ dev: 'dev.okafor@kestrelfen.example', sami: 'sami.virtanen@kestrelfen.example', maren: 'maren.holt@kestrelfen.example' })) {
      tokens[who] = await testApp.signIn(email, DEMO_PASSWORD);
    }
    fenLink = await setupId(testApp.app, tokens['dev'], 'Fen link');
  }, 60_000);
  afterAll(async () => {
    await testApp.close();
    fs.rmSync(scratch, { recursive: true, force: true });
  });

  it('signs each stored result; OpenSSL verifies the signature with the published key', async () => {
    const run = await analysed('accepted-run.csv');
    const keys = (await request(testApp.app).get('/api/signing-keys').expect(200)).body as SigningKeyDto[];
    expect(keys).toHaveLength(1);
    expect(keys[0]).toMatchObject({ algorithm: 'Ed25519', retiredAt: null });
    expect(run.signature).toMatchObject({ algorithm: 'Ed25519', keyId: keys[0].keyId });
    const { signedAt, ...signed } = run.signature!.statement;
    expect(signed).toEqual({ runId: run.id, fileSha256: run.file.sha256, fingerprint: (run.result as { fingerprint: string }).fingerprint });
    expect(typeof signedAt).toBe('string');

    // Outside check: OpenSSL 3 (`pkeyutl -rawin`, Ed25519) over the bytes the docs describe.
    const message = path.join(scratch, 'statement.bin');
    fs.writeFileSync(message, `bellkeep signed result v1\n${canonicalJson(run.signature!.statement)}`);
    fs.writeFileSync(path.join(scratch, 'signature.bin'), Buffer.from(run.signature!.signature, 'base64'));
    fs.writeFileSync(path.join(scratch, 'public.pem'), keys[0].publicKeyPem);
    const openssl = execFileSync('openssl', ['pkeyutl', '-verify', '-pubin', '-inkey', 'public.pem', '-rawin', '-in', 'statement.bin', '-sigfile', 'signature.bin'], {
      cwd: scratch,
      encoding: 'utf8',
    });
    expect(openssl).toContain('Signature Verified Successfully');

    const intact = await verification(run.id);
    expect(intact.intact).toBe(true);
    expect(intact.checks.map((check) => [check.check, check.passed])).toEqual([
      ['result-fingerprint', true],
      ['signature', true],
      ['archive-file', true],
      ['system-trail', true],
    ]);
  }, 60_000);

  it('the database refuses to change a signed result; a result changed behind its back fails the check, named', async () => {
    const run = await analysed('accepted-run.csv');
    await expect(sql(`UPDATE runs SET result = jsonb_set(result, '{chsh,winFraction}', '0.9') WHERE id = :id`, { id: run.id })).rejects.toThrow(/a signed result is fixed/);
    await expect(sql('DELETE FROM runs WHERE id = :id', { id: run.id })).rejects.toThrow(/signed result is kept/);

    await tamperRun(run.id, `result = jsonb_set(result, '{chsh,winFraction}', '0.9')`);
    const tampered = await verification(run.id);
    expect(tampered.intact).toBe(false);
    expect(checkOf(tampered, 'result-fingerprint').passed).toBe(false);
    expect(checkOf(tampered, 'result-fingerprint').detail).toContain('the result was changed after it was stored');
    expect(checkOf(tampered, 'archive-file').passed).toBe(true);

    // Resealing the changed result with a fresh fingerprint only moves the failure to the signature.
    const changed = (await testApp.database.models.Run.findByPk(run.id))!.result as unknown as AnalysisResult;
    await tamperRun(run.id, `result = jsonb_set(result, '{fingerprint}', to_jsonb(CAST(:fingerprint AS text)))`, { fingerprint: resultFingerprint(changed) });
    const resealed = await verification(run.id);
    expect(checkOf(resealed, 'result-fingerprint').passed).toBe(true);
    expect(checkOf(resealed, 'signature').passed).toBe(false);
    expect(checkOf(resealed, 'signature').detail).toContain('the signature does not match the signed statement');
    expect(resealed.intact).toBe(false);
  }, 60_000);

  it('a re-verification reproduces the fingerprint bit for bit and is kept beside the original', async () => {
    const run = await analysed('drifting-run.csv');
    await request(testApp.app).post(`/api/runs/${run.id}/reverifications`).set(bearer('dev')).expect(403);
    const queued = (await request(testApp.app).post(`/api/runs/${run.id}/reverifications`).set(bearer('sami')).expect(201)).body as ReverificationDto;
    expect(queued).toMatchObject({ runId: run.id, state: 'queued', requestedBy: 'Sami Virtanen', storedFingerprint: (run.result as { fingerprint: string }).fingerprint });

    const done = await waitForReverification(run.id, queued.id);
    expect(done).toMatchObject({
      state: 'reproduced',
      newFingerprint: queued.storedFingerprint,
      newEngineVersion: queued.storedEngineVersion,
      differences: [],
      differenceCount: 0,
    });
    const after = (await request(testApp.app).get(`/api/runs/${run.id}`).set(bearer('sami')).expect(200)).body as RunDto;
    expect(after.result).toEqual(run.result);
    expect(after.signature).toEqual(run.signature);
    const trail = (await request(testApp.app).get(`/api/runs/${run.id}/trail`).set(bearer('sami')).expect(200)).body as { action: string; details: Record<string, unknown> }[];
    expect(trail.map((event) => event.action)).toEqual(expect.arrayContaining(['run.reverification-requested', 'run.reverification-finished']));
    expect(trail.find((event) => event.action === 'run.reverification-finished')!.details).toMatchObject({ reverificationId: queued.id, state: 'reproduced' });
  }, 90_000);

  it('an archived file with one changed byte fails the check and its re-verification differs, naming the fields', async () => {
    const run = await analysed('aborted-low-chsh.csv');
    const archived = createLocalLogStore(testApp.config.dataDir).pathOf(run.file.sha256);
    const bytes = fs.readFileSync(archived);
    // A different outcome digit in the last row: still a valid log, not the signed one.
    const last = bytes.lastIndexOf(Buffer.from(',1'));
    bytes[last + 1] = '0'.charCodeAt(0);
    fs.chmodSync(archived, 0o644);
    fs.writeFileSync(archived, bytes);

    const result = await verification(run.id);
    expect(result.intact).toBe(false);
    expect(checkOf(result, 'archive-file').passed).toBe(false);
    expect(checkOf(result, 'archive-file').detail).toContain('its bytes were changed');
    expect(checkOf(result, 'signature').passed).toBe(true);

    const queued = (await request(testApp.app).post(`/api/runs/${run.id}/reverifications`).set(bearer('maren')).expect(201)).body as ReverificationDto;
    const done = await waitForReverification(run.id, queued.id);
    expect(done.state).toBe('differs');
    expect(done.differences).toEqual(
      expect.arrayContaining<FieldDifference>([{ path: 'input.sha256', stored: run.file.sha256, recomputed: expect.not.stringMatching(run.file.sha256) }]),
    );
    expect(done.differenceCount).toBeGreaterThanOrEqual(done.differences.length);

    fs.rmSync(archived, { force: true });
    const missing = checkOf(await verification(run.id), 'archive-file');
    expect(missing.passed).toBe(false);
    expect(missing.detail).toContain('it is missing');
  }, 90_000);

  it('the exported report verifies offline, and fails after one changed byte of the log or of the report', async () => {
    const run = await analysed('accepted-run.csv');
    const exported = await request(testApp.app).get(`/api/runs/${run.id}/export/json`).set(bearer('sami')).expect(200);
    expect(exported.headers['content-disposition']).toBe(`attachment; filename=bellkeep-run-${run.id}.json`);
    const report = JSON.parse(exported.text) as RunReportDto;
    expect(report).toMatchObject({
      format: 'bellkeep.run-report',
      formatVersion: 1,
      exportedBy: 'Sami Virtanen',
      seed: run.seed,
      run: { id: run.id, setupName: 'Fen link' },
      signature: run.signature,
    });
    const reportFile = path.join(scratch, 'report.json');
    fs.writeFileSync(reportFile, exported.text);

    const good = runVerify(reportFile, fixtureLog('accepted-run.csv'));
    expect(good.stdout).toContain('reproduces the fingerprint');
    expect(good.stdout).toContain('everything matches');
    expect(good.status).toBe(0);

    const changedLog = path.join(scratch, 'changed.csv');
    const bytes = fs.readFileSync(fixtureLog('accepted-run.csv'));
    bytes[bytes.lastIndexOf(Buffer.from(',1')) + 1] = '0'.charCodeAt(0);
    fs.writeFileSync(changedLog, bytes);
    const badLog = runVerify(reportFile, changedLog);
    expect(badLog.status).toBe(1);
    expect(badLog.stdout).toContain('✗ The log hashes to');

    // One byte of the report: a digit of the stored win fraction.
    const text = exported.text;
    const at = text.indexOf('"winFraction": ') + '"winFraction": 0.'.length;
    const changedReport = path.join(scratch, 'changed-report.json');
    fs.writeFileSync(changedReport, text.slice(0, at) + (text[at] === '9' ? '8' : '9') + text.slice(at + 1));
    const badReport = runVerify(changedReport, fixtureLog('accepted-run.csv'));
    expect(badReport.status).toBe(1);
    expect(badReport.stdout).toContain("✗ The report's result hashes to");

    // A report signed by someone else's key fails when the server's key is pinned.
    const pinned = path.join(scratch, 'other.pem');
    fs.writeFileSync(pinned, crypto.generateKeyPairSync('ed25519').publicKey.export({ format: 'pem', type: 'spki' }));
    const wrongKey = runVerify(reportFile, fixtureLog('accepted-run.csv'), '--public-key', pinned);
    expect(wrongKey.status).toBe(1);
    expect(wrongKey.stdout).toContain('not by the pinned key');

    expect(runVerify(reportFile).status).toBe(2);
  }, 120_000);

  it('an admin may re-analyse with another seed, never replacing the verdict; an auditor may not choose a seed', async () => {
    const run = await analysed('drifting-run.csv');
    const seed = 'c3'.repeat(32);
    await request(testApp.app).post(`/api/runs/${run.id}/reverifications`).set(bearer('sami')).send({ seed }).expect(403);
    await request(testApp.app).post(`/api/runs/${run.id}/reverifications`).set(bearer('maren')).send({ seed: 'not hex' }).expect(400);
    const queued = (await request(testApp.app).post(`/api/runs/${run.id}/reverifications`).set(bearer('maren')).send({ seed }).expect(201)).body as ReverificationDto;
    expect(queued.seed).toBe(seed);
    const done = await waitForReverification(run.id, queued.id);
    expect(done.state).toBe('differs');
    expect(done.newFingerprint).not.toBe(queued.storedFingerprint);
    expect((await testApp.database.models.Reverification.findByPk(queued.id))!.result).toMatchObject({ seed });
    const after = (await request(testApp.app).get(`/api/runs/${run.id}`).set(bearer('sami')).expect(200)).body as RunDto;
    expect({ verdict: after.verdict, result: after.result, seed: after.seed }).toEqual({ verdict: run.verdict, result: run.result, seed: run.seed });
  }, 90_000);

  it('exports the counts and blocks as CSV that add up to the result, and records every export', async () => {
    const run = await analysed('accepted-run.csv');
    const result = run.result as unknown as AnalysisResult;
    const counts = (await request(testApp.app).get(`/api/runs/${run.id}/export/counts.csv`).set(bearer('dev')).expect(200)).text.trim().split('\n');
    expect(counts[0]).toBe('subset,x,y,a,b,rounds');
    expect(counts).toHaveLength(1 + 2 * 24);
    const rounds = counts.slice(1).map((line) => line.split(','));
    expect(rounds.filter(([subset]) => subset === 'test').reduce((sum, row) => sum + Number(row[5]), 0)).toBe(result.selection!.testRounds);
    expect(rounds.reduce((sum, row) => sum + Number(row[5]), 0)).toBe(result.input.rounds);

    const blocks = (await request(testApp.app).get(`/api/runs/${run.id}/export/blocks.csv`).set(bearer('dev')).expect(200)).text.trim().split('\n');
    expect(blocks).toHaveLength(1 + result.blocks.length);
    expect(Number(blocks[1].split(',')[5])).toBe(result.blocks[0].chsh.fraction);

    await request(testApp.app).get(`/api/runs/${run.id}/export/xlsx`).set(bearer('dev')).expect(400);
    const trail = (
      await request(testApp.app)
        .get('/api/audit')
        .query({ action: 'run.exported', targetId: String(run.id) })
        .set(bearer('sami'))
        .expect(200)
    ).body as AuditPageDto;
    expect(trail.items.map((event) => [event.actor, event.details['format']])).toEqual([
      ['Dev Okafor', 'blocks.csv'],
      ['Dev Okafor', 'counts.csv'],
    ]);
  }, 60_000);

  it('the system trail filters, exports as CSV (itself recorded) and refuses changes at the database level', async () => {
    await request(testApp.app).get('/api/audit').set(bearer('dev')).expect(403);
    await request(testApp.app).get('/api/audit').query({ from: 'yesterday' }).set(bearer('sami')).expect(400);
    const runs = (await request(testApp.app).get('/api/audit').query({ action: 'run.', pageSize: 500 }).set(bearer('maren')).expect(200)).body as AuditPageDto;
    expect(runs.total).toBeGreaterThan(0);
    expect(runs.items.every((event) => event.action.startsWith('run.'))).toBe(true);
    expect(runs.items.map((event) => event.id)).toEqual([...runs.items.map((event) => event.id)].sort((a, b) => b - a));

    const csv = await request(testApp.app).get('/api/audit/export.csv').query({ action: 'run.uploaded' }).set(bearer('sami')).expect(200);
    expect(csv.headers['content-type']).toContain('text/csv');
    const lines = csv.text.trim().split('\n');
    expect(lines[0]).toBe('id,time,actor,action,target_type,target_id,details');
    expect(lines.slice(1).every((line) => line.includes(',Dev Okafor,run.uploaded,run,'))).toBe(true);
    const recorded = (await request(testApp.app).get('/api/audit').query({ action: 'audit.exported' }).set(bearer('sami')).expect(200)).body as AuditPageDto;
    expect(recorded.items[0]).toMatchObject({ actor: 'Sami Virtanen', details: { filter: { action: 'run.uploaded' }, rows: lines.length - 1 } });

    const actors = (await request(testApp.app).get('/api/audit/actors').set(bearer('sami')).expect(200)).body as { name: string }[];
    expect(actors.map((actor) => actor.name)).toEqual(expect.arrayContaining(['Dev Okafor', 'Sami Virtanen']));

    await expect(sql("UPDATE audit_events SET action = 'run.nothing'")).rejects.toThrow(/append-only/);
    await expect(sql('DELETE FROM audit_events')).rejects.toThrow(/append-only/);
  }, 60_000);

  it('a key rotation keeps the old public key listed; old signatures still verify; a retired key cannot sign again', async () => {
    const run = await analysed('accepted-run.csv');
    const oldKeyId = run.signature!.keyId;
    const { sequelize, models } = testApp.database;
    const newKey = signingKeyFromPem(crypto.generateKeyPairSync('ed25519').privateKey.export({ format: 'pem', type: 'pkcs8' }).toString());
    await createSigningKeysService(sequelize, models, testApp.services.audit, newKey).register();

    const keys = (await request(testApp.app).get('/api/signing-keys').expect(200)).body as SigningKeyDto[];
    expect(keys.map((key) => [key.keyId, key.retiredAt === null])).toEqual([
      [newKey.keyId, true],
      [oldKeyId, false],
    ]);
    expect((await verification(run.id)).intact).toBe(true);
    await expect(testApp.services.signingKeys.register()).rejects.toThrow(`The signing key ${oldKeyId} was retired`);
  }, 60_000);

  async function waitForReverification(runId: number, id: number): Promise<ReverificationDto> {
    const deadline = Date.now() + 60_000;
    for (;;) {
      const list = (await request(testApp.app).get(`/api/runs/${runId}/reverifications`).set(bearer('sami')).expect(200)).body as ReverificationDto[];
      const found = list.find((item) => item.id === id)!;
      if (!['queued', 'analysing'].includes(found.state)) return found;
      if (Date.now() > deadline) throw new Error(`Re-verification ${id} still ${found.state}`);
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
  }

  // Last: from here on the Fen link has an open booking, which every upload without a date joins.
  it('a booked run’s report checks the revealed seed against the commitment published at booking', async () => {
    const log = path.join(scratch, 'booked-night.csv');
    await writeModelLog(log, { ...steadyPair, rounds: 20_000 }, FIXTURE_SEED.slice(0, 60) + 'b00c');
    const booking = await bookOpenNight(testApp.app, tokens['dev'], { setupId: fenLink, night: '2026-12-04', plannedRounds: 20_000 });
    const created = (await uploadLog(testApp.app, tokens['dev'], log, { setupId: fenLink, bookingId: booking.id }).expect(201)).body as RunDto;
    await waitForFinishedRun(testApp.app, tokens['sami'], created.id);
    const exported = await request(testApp.app).get(`/api/runs/${created.id}/export/json`).set(bearer('sami')).expect(200);
    const reportFile = path.join(scratch, 'booked-report.json');
    fs.writeFileSync(reportFile, exported.text);
    const good = runVerify(reportFile, log);
    expect(good.stdout).toContain(`✓ The seed matches booking ${booking.id}'s commitment ${booking.seedCommitment}`);
    expect(good.status).toBe(0);

    // A report claiming another commitment (or, the same, another seed) no longer checks.
    const forged = path.join(scratch, 'forged-commitment.json');
    fs.writeFileSync(forged, exported.text.replaceAll(booking.seedCommitment, '0'.repeat(64)));
    const bad = runVerify(forged, log);
    expect(bad.stdout).toContain('✗ The seed hashes to');
    expect(bad.status).toBe(1);
  }, 120_000);
});
