import fs from 'node:fs';
import type { Page } from 'playwright-core';
import type { AnalysisResult } from '@shared/analysis/result';
import type { RunDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { startBrowserSession, type BrowserSession } from '../support/browser-session';
import { pdfText } from '../support/pdf-text';
import { fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';
import type { TestApp } from '../support/test-app';

/**
 * The auditor's work in a real headless Chromium: find a finished run by its fingerprint, check its
 * integrity, have it re-analysed from the archive, export its PDF report (its text read back), and
 * export the system trail.
 */
describe('auditing in a real browser', () => {
  let session: BrowserSession;
  let testApp: TestApp;
  let baseUrl: string;
  let run: RunDto;

  beforeAll(async () => {
    session = await startBrowserSession({ worker: true });
    ({ testApp, baseUrl } = session);
    const token = await testApp.signIn('dev.okafor@kestrelfen.example', DEMO_PASSWORD);
    const created = await uploadLog(testApp.app, token, fixtureLog('accepted-run.csv'), {
      setupId: await setupId(testApp.app, token, 'Fen link'),
      acquiredOn: '2026-11-28',
    }).expect(201);
    run = await waitForFinishedRun(testApp.app, token, (created.body as RunDto).id);
  }, 600_000);
  afterAll(() => session?.close());

  const signIn = (email: string) => session.signIn(email, { acceptDownloads: true });
  const screenshot = (page: Page, name: string) => session.screenshot(page, name);

  it('the auditor finds the run by fingerprint, checks it, re-verifies it and files its PDF report', async () => {
    const result = run.result as unknown as AnalysisResult;
    const page = await signIn('sami.virtanen@kestrelfen.example');
    await page.getByTestId('nav-audit').click();
    await page.getByTestId('audit-runs').waitFor();
    await page.getByLabel('Result digest').fill(result.fingerprint.slice(0, 10));
    await page.getByTestId(`audit-run-row-${run.id}`).waitFor();
    expect(await page.getByTestId('audit-runs').locator('tbody tr').count()).toBe(1);
    await session.expectNoAxeViolations(page, 'the finished runs tab');
    await screenshot(page, 'audit-finished-runs');

    await page.getByTestId(`audit-run-row-${run.id}`).click();
    await page.waitForURL(`${baseUrl}/runs/${run.id}`);
    await page.getByTestId('check-integrity').click();
    await page.getByTestId('verification-outcome').waitFor();
    expect(await page.getByTestId('verification-check-signature').innerText()).toContain('Intact');
    expect(await page.getByTestId('verification-check-archive-file').innerText()).toContain(run.file.sha256);

    await page.getByTestId('reverify').click();
    await page
      .locator('[data-testid^="reverification-state-"]')
      .filter({ hasText: /reproduced/i })
      .waitFor({ timeout: 30_000 });
    await session.expectNoAxeViolations(page, 'the run page with its integrity checked and re-verified');
    await screenshot(page, 'audit-run-integrity');

    await page.getByTestId('export-menu').click();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-pdf').click()]);
    expect(download.suggestedFilename()).toBe(`bellkeep-run-${run.id}.pdf`);
    const text = await pdfText(fs.readFileSync(await download.path()));
    expect(text).toContain('ACCEPT');
    expect(text).toContain(result.fingerprint);
    expect(text).toContain(run.file.sha256);
    expect(text).toContain(run.signature!.keyId);
    expect(text).toContain('Fen link');
    expect(text).toMatch(/collective/i);
    await page.close();
  }, 120_000);

  it('the auditor reads the system trail, sees the export recorded and exports the trail as CSV', async () => {
    const page = await signIn('sami.virtanen@kestrelfen.example');
    await page.goto(`${baseUrl}/audit`);
    await page.getByRole('tab', { name: /trail/i }).click();
    await page.getByTestId('audit-trail').waitFor();
    await page.getByTestId('audit-trail').getByText('Sami Virtanen').first().waitFor();
    expect(await page.getByTestId('audit-trail').innerText()).toMatch(/Sami Virtanen\s+Exported\s+Run \d+\s+PDF report/);
    await session.expectNoAxeViolations(page, 'the system trail tab');
    await screenshot(page, 'audit-system-trail');

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('audit-export-csv').click()]);
    const csv = fs
      .readFileSync(await download.path(), 'utf8')
      .trim()
      .split('\n');
    expect(csv[0]).toBe('id,time,actor,action,target_type,target_id,details');
    expect(csv.some((line) => line.includes('Sami Virtanen,run.exported,run,'))).toBe(true);

    await page.getByRole('tab', { name: /keys/i }).click();
    await page.getByTestId(`signing-key-${run.signature!.keyId}`).waitFor();
    expect(await page.getByTestId('signing-keys').innerText()).toContain('BEGIN PUBLIC KEY');
    await session.expectNoAxeViolations(page, 'the report-signing keys tab');
    await screenshot(page, 'audit-signing-keys');
    await page.close();
  }, 60_000);
});
