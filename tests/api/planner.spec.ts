import request from 'supertest';
import type { AnalysisResult } from '@shared/analysis/result';
import type { ApiErrorBody, GeneralAttackPlanDto, PlanDto, PlanPrefillDto, ProfileDto, RunDto } from '@shared/api';
import { winFractionFromChshValue } from '@shared/analysis/statistics/chsh-value';
import { planRounds } from '@shared/planner/plan-rounds';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { createTestApp, type TestApp } from '../support/test-app';
import { fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';

describe('the planner through the API', () => {
  let testApp: TestApp;
  let token: string;
  let fenLink: number;
  const bearer = () => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    testApp = await createTestApp();
    await testApp.startWorker();
    token = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    fenLink = await setupId(testApp.app, token, 'Fen link');
  }, 60_000);
  afterAll(() => testApp.close());

  it('answers the plan the shared planner makes with the profile version’s parameters', async () => {
    const version = await testApp.services.profiles.latestVersionOf(1);
    const response = await request(testApp.app)
      .get('/api/planner')
      .query({ chshValue: 2.72, qber: 0.02, profileVersionId: version.id, rounds: 2_000_000, trialRate: 10_000 })
      .set(bearer())
      .expect(200);
    const expected = planRounds({ device: { winFraction: winFractionFromChshValue(2.72), qber: 0.02, trialRate: 10_000 }, profile: version.parameters, rounds: 2_000_000 });
    const plan = response.body as PlanDto;
    expect(plan.device.winFraction).toBeCloseTo(0.84, 12);
    expect(plan.at).toEqual(JSON.parse(JSON.stringify(expected.at)));
    expect(plan.roundsForLikelyPass).toBe(expected.roundsForLikelyPass);
  });

  it('names a bad or missing input', async () => {
    const missing = await request(testApp.app).get('/api/planner').query({ qber: 0.02, profileVersionId: 1 }).set(bearer()).expect(400);
    expect((missing.body as ApiErrorBody).error.field).toBe('winFraction');
    const outOfRange = await request(testApp.app).get('/api/planner').query({ winFraction: 0.84, qber: 0.8, profileVersionId: 1 }).set(bearer()).expect(400);
    const outOfRangeError = (outOfRange.body as ApiErrorBody).error;
    expect(outOfRangeError.field).toBe('qber');
    expect(outOfRangeError.message).toContain('The expected QBER must be at least 0 and below 0.5');
    const noVersion = await request(testApp.app).get('/api/planner').query({ winFraction: 0.84, qber: 0.02, profileVersionId: 999 }).set(bearer()).expect(400);
    expect((noVersion.body as ApiErrorBody).error.field).toBe('profileVersionId');
  });

  it('plans the key against general attacks in a thread: the published design’s key at N, the smallest N and the best γ', async () => {
    // Nadlinger et al., Nature 607, 682 (2022), Supplementary Information: 95 884 bits at n = 1.5e6,
    // γ = 13/256: the sub-protocol of CHSH test and key-setting rounds of 8 657 227 log rounds at γ = 13/985.
    const admin = await testApp.signIn('maren.holt@kestrelfen.example', DEMO_PASSWORD);
    const parameters = {
      testSelection: { mode: 'bernoulli', probability: 13 / 985 },
      securityModel: 'general',
      generalAttack: { soundness: 1e-10, design: { chshValue: 2.64, qber: 0.018 } },
    };
    const profile = (await request(testApp.app).post('/api/profiles').set('Authorization', `Bearer ${admin}`).send({ name: 'Designed general trial', parameters }).expect(201))
      .body as ProfileDto;
    const query = { chshValue: 2.64, qber: 0.018, profileVersionId: profile.latestVersionId, rounds: 8_657_227 };
    const plan = (await request(testApp.app).get('/api/planner/general-attack').query(query).set(bearer()).expect(200)).body as GeneralAttackPlanDto;
    expect(Math.abs(plan.at.bits - 95_884)).toBeLessThanOrEqual(2);
    expect(plan.settings).toMatchObject({ source: 'profile', soundness: 1e-10, testProbability: 13 / 985 });
    expect(plan.at.sifted.rounds).toBe(1_500_000);
    expect(plan.roundsForPositiveKey).toBeLessThan(8_657_227);
    expect(plan.bestTestProbability!.bits).toBeGreaterThan(plan.at.bits);
    expect(plan.cautions.join(' ')).toContain('final security claims rest on the lab’s own proof');

    const local = await request(testApp.app).get('/api/planner/general-attack').query({ winFraction: 0.74, qber: 0.02, profileVersionId: 1 }).set(bearer()).expect(400);
    const localError = (local.body as ApiErrorBody).error;
    expect(localError.field).toBe('winFraction');
    expect(localError.message).toContain('at or below the local bound');
  }, 120_000);

  it('pre-fills from the setup’s accepted runs, pooled', async () => {
    const empty = (await request(testApp.app).get('/api/planner/prefill').query({ setupId: fenLink }).set(bearer()).expect(200)).body as PlanPrefillDto;
    expect(empty).toMatchObject({ setupId: fenLink, runIds: [], winFraction: null, qber: null, rounds: null });

    const runs: RunDto[] = [];
    for (const fixture of ['accepted-run.csv', 'accepted-run.csv']) {
      const created = await uploadLog(testApp.app, token, fixtureLog(fixture), { setupId: fenLink }).expect(201);
      runs.push(await waitForFinishedRun(testApp.app, token, (created.body as RunDto).id));
    }
    const results = runs.map((run) => run.result as unknown as AnalysisResult);
    const prefill = (await request(testApp.app).get('/api/planner/prefill').query({ setupId: fenLink }).set(bearer()).expect(200)).body as PlanPrefillDto;
    expect(prefill.runIds).toEqual([runs[1].id, runs[0].id]);
    expect(prefill.winFraction).toBeCloseTo((results[0].chsh!.wins + results[1].chsh!.wins) / (results[0].chsh!.rounds + results[1].chsh!.rounds), 12);
    expect(prefill.qber).toBeCloseTo((results[0].qber!.errors + results[1].qber!.errors) / (results[0].qber!.rounds + results[1].qber!.rounds), 12);
    expect(prefill.rounds).toBe(results[0].input.rounds);
    expect(prefill.xZeroProbability).toBeGreaterThan(0.4);
    expect(prefill.xZeroProbability).toBeLessThan(0.6);
  }, 60_000);
});
