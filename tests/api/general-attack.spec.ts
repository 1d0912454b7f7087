import request from 'supertest';
import { formatCount } from '@shared/format/numbers';
import { chshCriterion } from '@shared/analysis/report/verdict';
import type { AnalysisResult } from '@shared/analysis/result';
import type { ApiErrorBody, ProfileDto, RunDto, RunPageDto, SetupDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { createTestApp, type TestApp } from '../support/test-app';
import { pdfText } from '../support/pdf-text';
import { fixtureLog, setupId, uploadLog, waitForFinishedRun, waitForMail } from '../support/runs-api';

/** Round-by-round testing and the design of Nadlinger et al., Nature 607, 682 (2022) (S = 2.64, Q = 1.8 %, soundness 1e-10). */
const GENERAL = {
  testSelection: { mode: 'bernoulli', probability: 0.5 },
  securityModel: 'general',
  generalAttack: { soundness: 1e-10, design: { chshValue: 2.64, qber: 0.018 } },
};

describe('a profile under the general-attack model, through the API', () => {
  let testApp: TestApp;
  let admin: string;
  let dev: string;

  beforeAll(async () => {
    testApp = await createTestApp();
    await testApp.startWorker();
    admin = await testApp.signIn('maren.holt@kestrelfen.example', DEMO_PASSWORD);
    dev = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
  }, 60_000);
  afterAll(() => testApp.close());

  it('refuses a fixed-size test subset, and judges a run by ω_thr with its general-attack key recorded', async () => {
    const refused = await request(testApp.app)
      .post('/api/profiles')
      .set('Authorization', `Bearer ${admin}`)
      .send({ name: 'General, fixed subset', parameters: { ...GENERAL, testSelection: { mode: 'fixed-fraction', fraction: 0.5 } } })
      .expect(400);
    const { error } = refused.body as ApiErrorBody;
    expect(error.field).toBe('parameters.testSelection.mode');
    expect(error.message).toContain('a fixed-size subset is refused');

    const profile = (await request(testApp.app).post('/api/profiles').set('Authorization', `Bearer ${admin}`).send({ name: 'General trial', parameters: GENERAL }).expect(201))
      .body as ProfileDto;
    // An upload cannot choose its profile: the admin puts the setup under the general profile first.
    const fenLink = await setupId(testApp.app, dev, 'Fen link');
    const setup = (await request(testApp.app).get(`/api/setups/${fenLink}`).set('Authorization', `Bearer ${admin}`).expect(200)).body as SetupDto;
    await request(testApp.app)
      .put(`/api/setups/${fenLink}`)
      .set('Authorization', `Bearer ${admin}`)
      .send({
        name: setup.name,
        description: setup.description,
        stationALabel: setup.stationALabel,
        stationBLabel: setup.stationBLabel,
        defaultProfileId: profile.id,
        shiftLeadIds: setup.shiftLeads.map((lead) => lead.id),
        extraRecipients: setup.extraRecipients,
      })
      .expect(200);
    const created = await uploadLog(testApp.app, dev, fixtureLog('accepted-run.csv'), { setupId: fenLink }).expect(201);
    const run = await waitForFinishedRun(testApp.app, dev, (created.body as RunDto).id);
    const result = run.result as unknown as AnalysisResult;
    // 24 000 rounds are far too few for a key against general attacks: no key, with the reason.
    const general = result.key!.generalAttack!;
    expect(general).toMatchObject({ logRounds: 24_000, logTestProbability: 0.5, bits: 0 });
    expect(general.reason).toContain('give no key');
    const threshold = general.omegaThreshold;
    // Judged by the theorem's acceptance count against ω_thr, and every other rule of the verdict.
    expect(chshCriterion(result.chsh!, result.profile, result.key!.generalAttack).threshold).toBe(threshold);
    expect(run.verdict).toBe(result.reasons.length === 0 ? 'ACCEPT' : 'ABORT');

    const list = (await request(testApp.app).get('/api/runs').set('Authorization', `Bearer ${dev}`).expect(200)).body as RunPageDto;
    expect(list.items.find((item) => item.id === run.id)!.winThreshold).toBe(threshold);

    // The verdict mail and the PDF report name the general-attack figure and judge by ω_thr.
    const mail = await waitForMail(testApp.mailCatcher.inboxUrl, `Run ${run.id} of Fen link (unbooked) is analysed: ${run.verdict}; it awaits sign-off`);
    expect(mail.text).toContain(`no key against general attacks (entropy accumulation; over the ${formatCount(general.rounds)} CHSH test and key-setting generation rounds`);
    expect(mail.text).toContain(`(γ = 0.5000 of all ${formatCount(24_000)})`);
    expect(mail.text).toContain(`threshold ${threshold.toFixed(4)}`);
    const pdf = await request(testApp.app)
      .get(`/api/runs/${run.id}/export/pdf`)
      .set('Authorization', `Bearer ${dev}`)
      .buffer(true)
      .parse((response, done) => {
        // A binary body (the PDF) kept as bytes.
        const chunks: Buffer[] = [];
        response.on('data', (chunk: Buffer) => chunks.push(chunk));
        response.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    const text = await pdfText(pdf.body as Buffer);
    expect(text).toContain('Key against general attacks');
    expect(text).toContain(`≥ ${threshold.toFixed(6)} (ω_thr`);
  }, 60_000);
});
