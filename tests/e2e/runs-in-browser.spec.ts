import path from 'node:path';
import type { Page } from 'playwright-core';
import { startBrowserSession, type BrowserSession } from '../support/browser-session';
import type { TestApp } from '../support/test-app';

const FIXTURES = path.join(__dirname, '../../fixtures/logs');

/** A mail as the catcher's REST inbox lists it. */
interface CaughtMail {
  subject: string;
  text: string;
  to: { address: string }[];
}

/**
 * The night's work in a real headless Chromium on the production build: the experimentalist uploads
 * an accepted and an aborted log and watches them reach their verdicts; the shift lead follows the
 * verdict mail's link and signs the abort off; the auditor reads the run without any way to change it.
 */
describe('runs in a real browser', () => {
  let session: BrowserSession;
  let testApp: TestApp;
  let baseUrl: string;
  let abortedRunId: number;

  beforeAll(async () => {
    session = await startBrowserSession({ worker: true });
    ({ testApp, baseUrl } = session);
  }, 600_000);
  afterAll(() => session?.close());

  const signIn = (email: string) => session.signIn(email);
  const screenshot = (page: Page, name: string) => session.screenshot(page, name);

  const navPages = (page: Page) =>
    page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link')
      .evaluateAll((links) => links.map((link) => link.getAttribute('data-testid')?.replace(/^nav-/, '')));

  /** Uploads `file` on the Upload screen; with `checkScreens`, axe-core checks the preview and the verdict as they show. */
  async function uploadLog(page: Page, file: string, setup: string, checkScreens = false): Promise<{ word: string; reasons: string[]; runId: number }> {
    await page.getByTestId('setup-select').click();
    await page.getByRole('option', { name: setup }).click();
    // The setup's default profile is filled in.
    await page.getByTestId('profile-select').filter({ hasText: 'Nightly standard' }).waitFor();
    await page.getByTestId('log-input').setInputFiles(path.join(FIXTURES, file));
    await page.getByTestId('preview-status').filter({ hasText: 'The first 12 rows read cleanly under this mapping.' }).waitFor();
    expect(await page.getByTestId('preview').locator('tbody tr').count()).toBe(12);
    if (checkScreens) await session.expectNoAxeViolations(page, `the upload page previewing ${file}`);
    await screenshot(page, `upload-preview-${path.basename(file, '.csv')}`);

    await page.getByTestId('upload-button').click();
    await page.getByTestId('upload-progress').waitFor();
    // "Open run" comes as soon as the run exists; "Upload another log" once its verdict is in.
    await page.getByTestId('open-run').waitFor({ timeout: 30_000 });
    await page.getByRole('button', { name: 'Upload another log' }).waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('upload-progress').getAttribute('aria-valuenow')).toBe('100');
    if (checkScreens) await session.expectNoAxeViolations(page, `the upload page with the verdict of ${file}`);
    await screenshot(page, `upload-verdict-${path.basename(file, '.csv')}`);
    const word = await page.getByTestId('verdict-word').innerText();
    const reasons = await page.getByTestId('verdict-reasons').locator('li').allInnerTexts();
    const runId = Number((await page.getByTestId('open-run').getAttribute('href'))!.split('/').pop());
    return { word, reasons, runId };
  }

  it('the experimentalist uploads an accepted and an aborted log and sees each reach its verdict with the reasons', async () => {
    const page = await signIn('dev.okafor@kestrelfen.example');
    expect(await navPages(page)).toEqual(['overview', 'runs', 'upload', 'planner', 'setups', 'profiles']);
    await page.getByTestId('nav-upload').click();
    await page.waitForURL(`${baseUrl}/upload`);

    const accepted = await uploadLog(page, 'accepted-run.csv', 'Fen link');
    expect(accepted.word).toBe('ACCEPT');
    expect(accepted.reasons).toEqual([]);

    await page.getByRole('button', { name: 'Upload another log' }).click();
    const aborted = await uploadLog(page, 'aborted-low-chsh.csv', 'Fen link', true);
    expect(aborted.word).toBe('ABORT');
    // The first reason is the criterion; with so few rounds the bound may also miss the local bound ¾.
    expect(aborted.reasons[0]).toMatch(/^The CHSH win fraction 0\.[78]\d+ is below the threshold 0\.823553/);
    abortedRunId = aborted.runId;

    await page.getByTestId('open-run').click();
    await page.waitForURL(`${baseUrl}/runs/${abortedRunId}`);
    await page.getByTestId('criteria').waitFor();
    expect(await page.getByTestId('criteria').locator('tbody tr').first().innerText()).toMatch(
      /CHSH win fraction \(setting pairs weighed equally\)\s+0\.[78]\d+\s+≥ 0\.\d+\s+≥ 0\.8236[^\n]*\s+cancel\s*Fail/,
    );
    expect(await page.getByTestId('figure-finite-key').innerText()).toContain('Estimate against collective (i.i.d.) attacks.');
    await page.locator('canvas').nth(3).waitFor();
    await session.expectNoAxeViolations(page, 'the run page of an ABORT');
    await screenshot(page, 'run-aborted-experimentalist');

    await page.getByTestId('nav-runs').click();
    await page.getByTestId(`run-row-${abortedRunId}`).waitFor();
    expect(await page.getByTestId(`run-row-${abortedRunId}`).innerText()).toContain('ABORT');
    await session.expectNoAxeViolations(page, 'the runs list');
    await screenshot(page, 'runs-list');
    await page.close();
  }, 120_000);

  it('the shift lead finds the verdict mail, follows its link and signs the run off', async () => {
    let mail: CaughtMail | undefined;
    for (let attempt = 0; attempt < 60 && mail === undefined; attempt++) {
      const inbox = (await (await fetch(`${testApp.mailCatcher.inboxUrl}/api/email`)).json()) as CaughtMail[];
      mail = inbox.find((candidate) => candidate.text.includes(`/runs/${abortedRunId}`) && candidate.to.some((to) => to.address === 'lucia.brandt@kestrelfen.example'));
      if (mail === undefined) await new Promise((resolve) => setTimeout(resolve, 500));
    }
    expect(mail?.subject).toContain('ABORT');
    const link = mail!.text.match(/https?:\/\/\S+\/runs\/\d+/)![0];
    expect(link).toBe(`${baseUrl}/runs/${abortedRunId}`);

    const page = await signIn('lucia.brandt@kestrelfen.example');
    await page.goto(link);
    await page.getByTestId('sign-off-form').waitFor();
    await screenshot(page, 'run-sign-off-form');
    await page.getByRole('button', { name: 'Sign off' }).click();
    // The form refuses an empty decision and comment and says why, before anything is sent; an ABORT keeps no key.
    await page.getByText('Choose a decision before signing off.').waitFor();
    await page.getByText('Say why before signing off.').waitFor();
    await session.expectNoAxeViolations(page, 'the sign-off form refusing an empty decision');
    expect(await page.getByRole('radio', { name: 'Key kept' }).isDisabled()).toBe(true);
    await page.getByRole('radio', { name: 'Hardware action needed' }).check();
    await page.getByLabel('Comment').fill('Low CHSH all night: the Mill Lane detector is being realigned.');
    await page.getByRole('button', { name: 'Sign off' }).click();
    await page.getByTestId('recorded-sign-off').waitFor();
    expect(await page.getByTestId('recorded-sign-off').innerText()).toContain('Signed off by Lucia Brandt');
    expect(await page.getByTestId('recorded-sign-off').innerText()).toContain('Hardware action needed');
    await page.getByTestId('trail').getByText('Signed off', { exact: true }).waitFor();
    await screenshot(page, 'run-signed-off');
    await page.close();
  }, 60_000);

  it('the auditor reads the run, its sign-off and trail, with no upload and no sign-off form', async () => {
    const page = await signIn('sami.virtanen@kestrelfen.example');
    expect(await navPages(page)).toEqual(['overview', 'runs', 'setups', 'profiles', 'audit']);
    // Tablet width from here on.
    await page.setViewportSize({ width: 800, height: 900 });
    await page.goto(`${baseUrl}/runs/${abortedRunId}`);
    await page.getByTestId('recorded-sign-off').waitFor();
    expect(await page.getByTestId('verdict-word').innerText()).toBe('ABORT');
    expect(await page.getByTestId('sign-off-form').count()).toBe(0);
    expect(await page.getByTestId('provenance').innerText()).toMatch(/File SHA-256\s+[0-9a-f]{64}/);
    expect(await page.getByTestId('trail').locator('li').allInnerTexts()).toEqual([
      expect.stringContaining('Uploaded the log'),
      expect.stringContaining('Analysis started'),
      expect.stringContaining('Analysis finished'),
      expect.stringContaining('Verdict mail sent'),
      expect.stringContaining('Signed off'),
    ]);
    await screenshot(page, 'run-auditor-tablet');

    await page.goto(`${baseUrl}/upload`);
    await page.getByRole('heading', { name: 'Not allowed' }).waitFor();
    await page.goto(`${baseUrl}/setups`);
    await page.getByTestId('setup-1').locator('canvas').waitFor();
    await screenshot(page, 'setups-auditor-tablet');
    await page.goto(`${baseUrl}/profiles`);
    await page.getByTestId('profile-1').waitFor();
    expect(await page.getByRole('button', { name: 'New version' }).count()).toBe(0);
    await screenshot(page, 'profiles-auditor-tablet');
    await page.close();
  }, 60_000);
});
