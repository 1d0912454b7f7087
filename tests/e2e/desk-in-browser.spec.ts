import type { Locator, Page } from 'playwright-core';
import type { RunDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { startBrowserSession, type BrowserSession } from '../support/browser-session';
import { fixtureLog, setupId, uploadLog, waitForFinishedRun } from '../support/runs-api';

/** The YYYY-MM-DD of the night `nightsAgo` nights before today (the ledger's nights are UTC dates). */
const night = (nightsAgo: number) => new Date(Date.now() - nightsAgo * 86_400_000).toISOString().slice(0, 10);

/** That night as the ledger names it in the test browser's locale (en-US): "Dec 4, 2026". */
const nightWords = (nightsAgo: number) =>
  new Intl.DateTimeFormat('en-US', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${night(nightsAgo)}T00:00:00Z`));

/**
 * The lab's desk in a real headless Chromium, over three nights of the Fen link: the ledger is the
 * first screen, each night by icon and word, a cell opens its run; the shift lead's worklist counts
 * the runs awaiting sign-off and shrinks by the one signed off; the person who is both
 * experimentalist and shift lead is told why their own upload has no sign-off form; and on a phone
 * the lists are cards, not tables scrolling sideways.
 */
describe("the lab's desk in a real browser", () => {
  let session: BrowserSession;
  let baseUrl: string;
  /** Dev Okafor's accepted night (three nights ago) and aborted night (last night); Ada Reyes's own night (two nights ago). */
  const runs = { accepted: 0, aborted: 0, adasOwn: 0 };

  beforeAll(async () => {
    session = await startBrowserSession({ worker: true });
    const { testApp } = session;
    ({ baseUrl } = session);
    const upload = async (email: string, log: string, acquiredOn: string) => {
      const token = await testApp.signIn(email, DEMO_PASSWORD);
      const created = await uploadLog(testApp.app, token, fixtureLog(log), { setupId: await setupId(testApp.app, token, 'Fen link'), acquiredOn }).expect(201);
      return (await waitForFinishedRun(testApp.app, token, (created.body as RunDto).id, 60_000)).id;
    };
    runs.accepted = await upload('dev.okafor@kestrelfen.example', 'accepted-run.csv', night(3));
    runs.aborted = await upload('dev.okafor@kestrelfen.example', 'aborted-low-chsh.csv', night(1));
    runs.adasOwn = await upload('ada.reyes@kestrelfen.example', 'drifting-run.csv', night(2));
  }, 600_000);
  afterAll(() => session?.close());

  /** The worklist of runs awaiting the signed-in shift lead's sign-off, once it shows `count`: the runs it lists. */
  async function awaitingSignOff(page: Page, count: number): Promise<number[]> {
    const list = page.getByTestId('worklist-sign-off');
    await list.getByLabel(`${count} in all`).waitFor();
    const links = await list.getByRole('link', { name: /^Run \d+$/ }).allInnerTexts();
    return links.map((link) => Number(link.replace('Run ', ''))).sort((a, b) => a - b);
  }

  it('shows the shift lead the ledger first, opens a night from it, and takes the signed-off run off the worklist', async () => {
    const page = await session.signIn('lucia.brandt@kestrelfen.example');
    expect(page.url()).toBe(`${baseUrl}/`);
    await page.getByTestId('ledger').waitFor();
    const aborted = page.getByRole('link', { name: `Fen link, night of ${nightWords(1)}: ABORT, to sign (awaiting sign-off), unbooked` });
    // The verdict by icon and word, never the colour alone.
    expect(await aborted.locator('mat-icon').innerText()).toBe('block');
    expect(await aborted.innerText()).toMatch(/^block\s+ABORT\s+to sign$/);
    await page.getByRole('link', { name: `Fen link, night of ${nightWords(3)}: ACCEPT, to sign (awaiting sign-off), unbooked` }).waitFor();
    expect(await awaitingSignOff(page, 3)).toEqual([runs.accepted, runs.adasOwn, runs.aborted].sort((a, b) => a - b));
    await session.expectNoAxeViolations(page, 'the overview: worklists and ledger');
    await session.screenshot(page, 'desk-ledger-shift-lead');

    await aborted.click();
    await page.waitForURL(`${baseUrl}/runs/${runs.aborted}`);
    await page.getByTestId('sign-off-form').waitFor();
    // The decision form: an ABORT keeps no key, so that choice is greyed out.
    expect(await page.getByRole('radio', { name: 'Key kept' }).isDisabled()).toBe(true);
    expect(await page.getByRole('radio', { name: 'Key discarded' }).isDisabled()).toBe(false);
    expect(await page.getByRole('radio', { name: 'Hardware action needed' }).isDisabled()).toBe(false);
    await page.locator('canvas').nth(3).waitFor();
    // Every chart's data opened as a table, its text equivalent.
    const showTables = page.getByRole('button', { name: 'Show as table' });
    const charts = await showTables.count();
    expect(charts).toBeGreaterThanOrEqual(3);
    // One at a time: each click turns the first "Show as table" left into a "Hide the table".
    for (let opened = 1; opened <= charts; opened++) {
      await showTables.first().click();
      await page
        .getByRole('button', { name: 'Hide the table' })
        .nth(opened - 1)
        .waitFor();
    }
    expect(await page.getByRole('button', { name: 'Hide the table' }).count()).toBe(charts);
    await page
      .getByRole('table', { name: /^The correlators, whose sum is S/ })
      .getByRole('row', { name: /^E00 / })
      .waitFor();
    await session.expectNoAxeViolations(page, 'the run page with the sign-off form and its charts as tables');
    await session.screenshot(page, 'desk-run-charts-as-tables');
    await page.getByRole('radio', { name: 'Key discarded' }).check();
    await page.getByLabel('Comment').fill('Too few rounds won last night: nothing of it goes to the key store.');
    await page.getByRole('button', { name: 'Sign off' }).click();
    await page.getByTestId('recorded-sign-off').filter({ hasText: 'Key discarded' }).waitFor();

    await page.getByTestId('nav-overview').click();
    expect(await awaitingSignOff(page, 2)).toEqual([runs.accepted, runs.adasOwn].sort((a, b) => a - b));
    await page.getByRole('link', { name: `Fen link, night of ${nightWords(1)}: ABORT, discarded (signed off: key discarded), unbooked` }).waitFor();
    await session.screenshot(page, 'desk-ledger-after-sign-off');
    await page.close();
  }, 120_000);

  it('tells the experimentalist who also leads the shift why their own upload has no sign-off form', async () => {
    const page = await session.signIn('ada.reyes@kestrelfen.example');
    // Her own upload waits for another lead, not for her; the signed-off night waits for no one.
    expect(await awaitingSignOff(page, 1)).toEqual([runs.accepted]);
    await page.getByTestId('worklist-uploads').getByLabel('0 in all').waitFor();

    await page.getByRole('link', { name: new RegExp(`^Fen link, night of ${nightWords(2)}: `) }).click();
    await page.waitForURL(`${baseUrl}/runs/${runs.adasOwn}`);
    const note = page.getByTestId('four-eyes-note');
    await note.waitFor();
    expect(await note.innerText()).toBe('You uploaded this run. Under the four-eyes rule of Fen link, another shift lead signs it off (Lucia Brandt).');
    expect(await page.getByTestId('sign-off-form').count()).toBe(0);
    await page.close();
  }, 60_000);

  it('shows the admin every list whole at 1280 px, with its dialogs, and as cards on a 390 px phone', async () => {
    const page = await session.signIn('maren.holt@kestrelfen.example');
    // By their names rather than their roles: a table shown as cards need not keep the table role.
    const runTable = page.locator('table[aria-label="Runs"]');
    const userTable = page.locator('table[aria-label="Users"]');
    const screens = [
      { name: 'runs', path: '/runs', ready: page.getByTestId(`run-row-${runs.aborted}`) },
      { name: 'run-accepted', path: `/runs/${runs.accepted}`, ready: page.getByTestId('criteria') },
      { name: 'setups', path: '/setups', ready: page.getByTestId('setup-1').locator('canvas') },
      { name: 'profiles', path: '/profiles', ready: page.getByTestId('profile-1') },
      { name: 'trail', path: '/audit?tab=trail', ready: page.getByTestId('audit-trail') },
      { name: 'users', path: '/users', ready: userTable },
      { name: 'ledger', path: '/', ready: page.getByTestId('ledger') },
    ];
    for (const screen of screens) {
      await page.goto(`${baseUrl}${screen.path}`);
      await screen.ready.waitFor();
      // The other screens are checked where their own tests visit them; these two as an admin, who may edit them.
      if (screen.name === 'setups' || screen.name === 'profiles') await session.expectNoAxeViolations(page, `the ${screen.name} list of an admin`);
      await session.screenshot(page, `desk-${screen.name}-1280`);
    }

    await page.goto(`${baseUrl}/setups`);
    await session.expectDialogWithoutAxeViolations(page, 'the setup dialog', () => page.getByRole('button', { name: 'Edit Fen link' }).click());
    await page.goto(`${baseUrl}/profiles`);
    await session.expectDialogWithoutAxeViolations(page, 'the profile dialog', () => page.getByRole('button', { name: 'New version' }).first().click());

    await page.setViewportSize({ width: 390, height: 844 });
    for (const screen of screens) {
      await page.goto(`${baseUrl}${screen.path}`);
      await screen.ready.waitFor();
      await session.screenshot(page, `desk-${screen.name}-390`);
      if (screen.name === 'runs') await expectCards(runTable, ['Verdict', 'Run', 'Setup', 'Acquired', 'Win fraction']);
      if (screen.name === 'trail') await expectCards(page.getByTestId('audit-trail'), ['When', 'Who', 'What happened', 'About']);
      if (screen.name === 'users') {
        await expectCards(userTable, ['Name', 'E-mail', 'Roles', 'State']);
        await expectUnbrokenWithin(userTable.locator('bk-email-address').filter({ hasText: 'sami.virtanen@kestrelfen.example' }), ['sami', '.virtanen@', 'kestrelfen', '.example']);
      }
    }
    // A verdict chip keeps its icon whole and its word on one line in a card.
    await page.goto(`${baseUrl}/runs`);
    const chip = runTable.getByTestId('verdict-chip').first();
    await chip.waitFor();
    expect(await chip.evaluate((element) => [element.querySelector('mat-icon')!.getBoundingClientRect().width, element.scrollWidth <= element.clientWidth])).toEqual([18, true]);
    await page.close();
  }, 180_000);
});

/**
 * A list shown as cards: no table head, nothing scrolling sideways, each row a card as wide as the
 * list, and each of `labels` drawn above its value in every card.
 */
async function expectCards(table: Locator, labels: string[]): Promise<void> {
  await table.locator('tbody tr').first().waitFor();
  const look = await table.evaluate((element: HTMLTableElement) => {
    const frame = element.parentElement!;
    const rows = Array.from(element.tBodies[0].rows);
    return {
      headShown: getComputedStyle(element.tHead!).display !== 'none',
      scrollsSideways: frame.scrollWidth > frame.clientWidth,
      cardWidths: rows.map((row) => Math.round(row.getBoundingClientRect().width - element.getBoundingClientRect().width)),
      drawnLabels: rows.map((row) =>
        Array.from(row.cells)
          .map((cell) => getComputedStyle(cell, '::before').content)
          .filter((content) => content !== 'none'),
      ),
    };
  });
  expect(look.headShown).toBe(false);
  expect(look.scrollsSideways).toBe(false);
  for (const width of look.cardWidths) expect(width).toBe(0);
  for (const drawn of look.drawnLabels) expect(drawn).toEqual(expect.arrayContaining(labels.map((label) => JSON.stringify(label))));
}

/** An e-mail address broken, if at all, only between `parts` (after the @, before a dot): each part sits on one line. */
async function expectUnbrokenWithin(address: Locator, parts: string[]): Promise<void> {
  const lines = await address.evaluate((element) =>
    Array.from(element.querySelectorAll('.bk-email-part')).map((node) => {
      const range = document.createRange();
      range.selectNodeContents(node);
      return { text: node.textContent, lines: new Set(Array.from(range.getClientRects(), (rect) => Math.round(rect.top))).size };
    }),
  );
  expect(lines).toEqual(parts.map((text) => ({ text, lines: 1 })));
}
