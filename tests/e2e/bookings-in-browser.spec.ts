import { execFile } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import type { Page } from 'playwright-core';
import type { RunDto } from '@shared/api';
import { REVEALED_SEED_CAUTION } from '@shared/format/booking-words';
import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';
import { writeModelLog } from '@fixtures/model-log-file';
import { UPLOAD_TOKEN_PLACEHOLDER } from '../../src/app/setups/acquisition-recipe';
import { startBrowserSession, type BrowserSession } from '../support/browser-session';
import { waitForFinishedRun } from '../support/runs-api';

const run = promisify(execFile);

/**
 * A booked night in a real headless Chromium: a shift lead books tonight from the Planner and makes
 * the acquisition computer's upload token; the setup page's curl recipe, run by bash, uploads the
 * night; the run page checks the revealed seed against the commitment; the experimentalist
 * replaces the log with a reason, and the run shows as attempt 2 on its page and in the list.
 */
describe('booked nights in a real browser', () => {
  let session: BrowserSession;
  let scratch: string;
  const logs: string[] = [];

  beforeAll(async () => {
    session = await startBrowserSession({ worker: true });
    scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-booked-'));
    for (const night of [1, 2]) {
      const file = path.join(scratch, `north-hall-night-${night}.csv`);
      await writeModelLog(file, { ...steadyPair, rounds: 40_000 }, FIXTURE_SEED.slice(0, 60) + `e2e${night}`);
      logs.push(file);
    }
  }, 600_000);
  afterAll(async () => {
    await session?.close();
    fs.rmSync(scratch, { recursive: true, force: true });
  });

  const screenshot = (page: Page, name: string) => session.screenshot(page, name);

  it('books tonight from the Planner, uploads by the curl recipe with a token, checks the commitment, and shows a replacement as attempt 2', async () => {
    const { baseUrl, testApp } = session;
    const lead = await session.signIn('lucia.brandt@kestrelfen.example');
    await lead.getByTestId('nav-planner').click();
    await lead.getByTestId('planner-setup').click();
    await lead.getByRole('option', { name: 'Fen link' }).click();
    await lead.getByTestId('book-night').click();
    // The window opens at 20:00 tonight by default; this night's acquisition is already under way.
    const now = new Date(Date.now() - 5 * 60_000);
    const local = (date: Date) => new Date(date.getTime() - date.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
    await lead.getByTestId('book-night-date').fill(local(now).slice(0, 10));
    await lead.getByTestId('book-window-start').fill(local(now));
    await lead.getByTestId('book-window-end').fill(local(new Date(now.getTime() + 10 * 3_600_000)));
    // Fen link has no accepted run here, so the Planner has no rounds to pass on.
    await lead.getByTestId('book-rounds').fill('40000');
    await session.expectNoAxeViolations(lead, 'the book-night dialog');
    await screenshot(lead, 'booking-dialog');
    await lead.getByTestId('book-submit').click();
    const commitment = (await lead.getByTestId('booked-commitment').innerText()).trim();
    expect(commitment).toMatch(/^[0-9a-f]{64}$/);
    await screenshot(lead, 'booking-booked');
    await lead.getByTestId('booked-setup-link').click();

    // The setup page: the booking with its commitment, a new upload token, the recipe.
    await lead
      .getByTestId('bookings')
      .filter({ hasText: commitment.slice(0, 8) })
      .waitFor();
    await lead.getByTestId('new-token-button').click();
    await lead.getByTestId('token-name').fill('North Hall acquisition PC');
    await lead.getByTestId('token-create').click();
    const token = (await lead.getByTestId('new-token').innerText()).trim();
    expect(token).toMatch(/^bkup_/);
    await session.expectNoAxeViolations(lead, 'the new upload token dialog');
    await lead.getByTestId('token-done').click();
    await lead.getByTestId('upload-tokens').filter({ hasText: 'North Hall acquisition PC' }).waitFor();
    const recipe = await lead.getByTestId('acquisition-recipe').innerText();
    expect(recipe).toContain(`${baseUrl}/api/uploads`);
    await session.expectNoAxeViolations(lead, 'the setup page with a booking and an upload token');
    await screenshot(lead, 'setup-page-booked');

    // The acquisition computer runs the recipe with its token.
    const script = path.join(scratch, 'send-log.sh');
    fs.writeFileSync(script, recipe.replace(UPLOAD_TOKEN_PLACEHOLDER, token));
    const sent = await run('bash', [script, logs[0]], { cwd: scratch });
    const first = JSON.parse(sent.stdout) as RunDto;
    expect(first).toMatchObject({ uploadedBy: 'upload token “North Hall acquisition PC”', attempt: 1, booking: { seedCommitment: commitment } });
    expect(first.file.sha256).toBe(crypto.createHash('sha256').update(fs.readFileSync(logs[0])).digest('hex'));

    const signInToken = await testApp.signIn('dev.okafor@kestrelfen.example', 'fen-demo-2026');
    await waitForFinishedRun(testApp.app, signInToken, first.id, 60_000);
    await lead.goto(`${baseUrl}/runs/${first.id}`);
    await lead.getByTestId('booking-headline').filter({ hasText: 'attempt 1 of 1' }).waitFor();
    await lead
      .getByTestId('commitment-outcome')
      .filter({ hasText: /matches/i })
      .waitFor();
    await session.expectNoAxeViolations(lead, 'the run page of a booked night');
    await screenshot(lead, 'run-booked');
    await lead.close();

    // The experimentalist replaces the night's log on the Upload screen, with a reason.
    const dev = await session.signIn('dev.okafor@kestrelfen.example');
    await dev.getByTestId('nav-upload').click();
    await dev.getByTestId('setup-select').click();
    await dev.getByRole('option', { name: 'Fen link' }).click();
    await dev.getByTestId('log-input').setInputFiles(logs[1]);
    await dev.getByTestId('replacement').waitFor();
    await dev.getByTestId('replacement-reason').fill('The first file was copied before the acquisition computer had closed it.');
    await dev.getByTestId('preview-status').waitFor();
    await session.expectNoAxeViolations(dev, 'the upload page replacing a booked log');
    await screenshot(dev, 'upload-replacement');
    await dev.getByTestId('upload-button').click();
    await dev.getByTestId('open-run').waitFor({ timeout: 60_000 });
    const secondId = Number((await dev.getByTestId('open-run').getAttribute('href'))!.split('/').pop());
    await waitForFinishedRun(testApp.app, signInToken, secondId, 60_000);

    await dev.goto(`${baseUrl}/runs/${secondId}`);
    await dev.getByTestId('booking-headline').filter({ hasText: 'attempt 2 of 2' }).waitFor();
    const panel = await dev.getByTestId('run-booking').innerText();
    expect(panel).toContain('The first file was copied before the acquisition computer had closed it.');
    expect(panel).toContain(REVEALED_SEED_CAUTION);
    await dev
      .getByTestId('commitment-outcome')
      .filter({ hasText: /matches/i })
      .waitFor();
    await screenshot(dev, 'run-replacement');

    await dev.getByTestId('nav-runs').click();
    await dev.getByTestId(`booking-note-${secondId}`).filter({ hasText: 'attempt 2' }).waitFor();
    await screenshot(dev, 'runs-list-attempts');
    await dev.close();
  }, 300_000);
});
