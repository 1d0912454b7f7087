import { formatCount } from '@shared/format/numbers';
import { generalKeyPoint, generalPlanProblem } from '@shared/planner/plan-general-attack';
import { planRounds } from '@shared/planner/plan-rounds';
import { startBrowserSession, type BrowserSession } from '../support/browser-session';

/** The experimentalist plans tonight's budget in a real headless Chromium; the page's numbers are the shared planner's. */
describe('the planner in a real browser', () => {
  let session: BrowserSession;

  beforeAll(async () => {
    session = await startBrowserSession({ worker: false });
  }, 600_000);
  afterAll(() => session?.close());

  it('computes the plan in the page from the chosen profile, with both charts', async () => {
    const { testApp } = session;
    const page = await session.signIn('dev.okafor@kestrelfen.example');
    await page.getByTestId('nav-planner').click();
    await page.getByTestId('planner-form').waitFor();

    const version = await testApp.services.profiles.latestVersionOf(1);
    const profileName = (await testApp.database.models.Profile.findByPk(1))!.name;
    await page.getByLabel('Profile version').click();
    await page.getByRole('option', { name: `${profileName} v${version.version}` }).click();
    await page.getByLabel('Expected win fraction').fill('0.84');
    await page.getByLabel('Expected QBER (%)').fill('2');
    await page.getByLabel('Rounds (N)').fill('2e7');
    await page.getByLabel('Rounds per second').fill('10000');

    const plan = planRounds({ device: { winFraction: 0.84, qber: 0.02, trialRate: 10_000 }, profile: version.parameters, rounds: 20_000_000 });
    await page
      .getByTestId('plan-key-bits')
      .filter({ hasText: formatCount(plan.at.expectedFiniteKeyBits) })
      .waitFor();
    expect(await page.getByTestId('plan-rounds-for-key').innerText()).toContain(formatCount(plan.roundsForPositiveKey!));
    expect(await page.getByTestId('plan-rounds-for-pass').innerText()).toContain(formatCount(plan.roundsForLikelyPass!));
    await page.getByTestId('planner-chart-rounds').locator('canvas').waitFor();
    await page.getByTestId('planner-chart-fraction').locator('canvas').waitFor();
    await session.expectNoAxeViolations(page, 'the planner');
    await session.screenshot(page, 'planner');

    // The key against general attacks comes from the page's web workers, part by part.
    const input = { device: { winFraction: 0.84, qber: 0.02, trialRate: 10_000 }, profile: version.parameters, rounds: 20_000_000 };
    const general = generalKeyPoint(generalPlanProblem(input, plan), 20_000_000);
    await page
      .getByTestId('plan-general-bits')
      .filter({ hasText: `${formatCount(general.bits)} bits` })
      .waitFor();
    await page.getByTestId('plan-general-rounds-for-key').filter({ hasNotText: 'Computing' }).waitFor({ timeout: 120_000 });
    // At γ = 0.5 the profile's own testing leaves no key against general attacks; a smaller γ does.
    await page.getByTestId('plan-general-best-gamma').filter({ hasText: 'γ =' }).waitFor({ timeout: 120_000 });
    expect(await page.getByTestId('plan-general-model').innerText()).toContain('Attack model: general');
    await page.getByTestId('planner-general').scrollIntoViewIfNeeded();
    await session.screenshot(page, 'planner-general-attack');
    await page.getByTestId('planner-chart-rounds').scrollIntoViewIfNeeded();
    await session.screenshot(page, 'planner-general-curve');
    await page.close();
  }, 300_000);
});
