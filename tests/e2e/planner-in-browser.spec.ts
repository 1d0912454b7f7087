import fs from 'node:fs';
import path from 'node:path';
import type { Server } from 'node:http';
import type { Browser } from 'playwright-core';
import { formatCount } from '../../shared/format/numbers';
import { planRounds } from '../../shared/planner/plan-rounds';
import { DEMO_PASSWORD } from '../../seeders/data/demo-people';
import { launchChromium } from '../support/chromium';
import { freePort } from '../support/free-port';
import { createTestApp, type TestApp } from '../support/test-app';

const SCREENSHOTS = path.join(__dirname, '../../.data/e2e-screenshots');

/** The experimentalist plans tonight's budget in a real headless Chromium; the page's numbers are the shared planner's. */
describe('the planner in a real browser', () => {
  let testApp: TestApp;
  let server: Server;
  let browser: Browser;
  let baseUrl: string;

  beforeAll(async () => {
    const port = await freePort();
    baseUrl = `http://127.0.0.1:${port}`;
    testApp = await createTestApp({ BELLKEEP_PUBLIC_URL: baseUrl });
    server = testApp.app.listen(port, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    browser = await launchChromium();
    fs.mkdirSync(SCREENSHOTS, { recursive: true });
  }, 600_000);

  afterAll(async () => {
    await browser?.close();
    await new Promise((resolve) => server?.close(resolve));
    await testApp?.close();
  });

  it('computes the plan in the page from the chosen profile, with both charts', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('dev.okafor@kestrelfen.example');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('nav-planner').click();
    await page.getByTestId('planner-form').waitFor();

    const version = await testApp.services.profiles.latestVersionOf(1);
    const profileName = (await testApp.database.models.Profile.findByPk(1))!.name;
    await page.getByLabel('Profile version').click();
    await page.getByRole('option', { name: `${profileName} v${version.version}` }).click();
    await page.getByLabel('Expected win fraction').fill('0.84');
    await page.getByLabel('Expected QBER (%)').fill('2');
    await page.getByLabel('Rounds (N)').fill('2e6');
    await page.getByLabel('Trial rate (rounds/s)').fill('10000');

    const plan = planRounds({ device: { winFraction: 0.84, qber: 0.02, trialRate: 10_000 }, profile: version.parameters, rounds: 2_000_000 });
    await page.getByTestId('plan-key-bits').filter({ hasText: formatCount(plan.at.expectedFiniteKeyBits) }).waitFor();
    expect(await page.getByTestId('plan-rounds-for-key').innerText()).toContain(formatCount(plan.roundsForPositiveKey!));
    expect(await page.getByTestId('plan-rounds-for-pass').innerText()).toContain(formatCount(plan.roundsForLikelyPass!));
    await page.getByTestId('planner-chart-rounds').locator('canvas').waitFor();
    await page.getByTestId('planner-chart-fraction').locator('canvas').waitFor();
    await page.screenshot({ path: path.join(SCREENSHOTS, 'planner.png'), fullPage: true });
    await page.close();
  }, 60_000);
});
