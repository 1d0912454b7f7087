import type { Browser, Page } from 'playwright-core';
import { startBrowserSession, type BrowserSession } from '../support/browser-session';

/**
 * A real headless Chromium on the production build served by the real API: two demo people of
 * different roles sign in, each sees the navigation their roles allow, and the experimentalist is
 * refused the admin's page.
 */
describe('sign-in and roles in a real browser', () => {
  let session: BrowserSession;
  let browser: Browser;
  let baseUrl: string;

  beforeAll(async () => {
    session = await startBrowserSession({ worker: false });
    ({ browser, baseUrl } = session);
  }, 600_000);
  afterAll(() => session?.close());

  const signIn = (page: Page, email: string) => session.signInOn(page, email);

  /** The pages the side navigation offers, by their link's test id (`nav-<page>`). */
  const navPages = (page: Page) =>
    page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link')
      .evaluateAll((links) => links.map((link) => link.getAttribute('data-testid')?.replace(/^nav-/, '')));

  it('the admin sees Users and opens the user list and its dialogs; the page loads nothing from elsewhere and its fonts are its own', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    const requested: string[] = [];
    page.on('request', (pageRequest) => requested.push(pageRequest.url()));
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').waitFor();
    await session.expectNoAxeViolations(page, 'the sign-in page');
    await signIn(page, 'maren.holt@kestrelfen.example');
    expect(await navPages(page)).toEqual(['overview', 'runs', 'planner', 'setups', 'profiles', 'audit', 'users', 'workers']);

    await page.getByTestId('nav-users').click();
    await page.waitForURL(`${baseUrl}/users`);
    await page.getByRole('cell', { name: 'sami.virtanen@kestrelfen.example' }).waitFor();
    await session.expectNoAxeViolations(page, 'the user list');
    await session.expectDialogWithoutAxeViolations(page, 'the new user dialog', () => page.getByRole('button', { name: 'New user' }).click());
    await session.expectDialogWithoutAxeViolations(page, 'the password dialog', async () => {
      await page.getByTestId('user-menu').click();
      await page.getByTestId('change-password').click();
    });

    // The full stylesheet applies (helmet's policy allows how it is linked) and the shipped fonts load.
    await page.evaluate(() => document.fonts.ready);
    expect(await page.evaluate(() => getComputedStyle(document.body).fontFamily)).toMatch(/^Roboto/);
    const loadedFonts = await page.evaluate(() => [...document.fonts].filter((face) => face.status === 'loaded').map((face) => face.family.replace(/"/g, '')));
    expect(loadedFonts).toEqual(expect.arrayContaining(['Roboto', 'Material Symbols Outlined']));
    expect(requested.filter((url) => !url.startsWith(baseUrl) && !url.startsWith('data:'))).toEqual([]);
    await page.close();
  }, 60_000);

  it('the accessibility check fails on a broken page, naming the rule, its help and the element', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').waitFor();
    // A button with neither words nor a label: nobody using a screen reader can tell what it does.
    await page.locator('form').evaluate((form) => form.insertAdjacentHTML('beforeend', '<button type="button" id="bk-nameless"></button>'));
    await expect(session.expectNoAxeViolations(page, 'a sign-in page with a nameless button')).rejects.toThrow(
      /broken on a sign-in page with a nameless button:\n[\s\S]*- button-name: Buttons must have discernible text\n {4}#bk-nameless\n/,
    );
    await page.close();
  }, 60_000);

  it('the experimentalist sees no Users link and is refused the page; signing out ends the session', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signIn(page, 'dev.okafor@kestrelfen.example');
    expect(await navPages(page)).toEqual(['overview', 'runs', 'upload', 'planner', 'setups', 'profiles']);

    await page.goto(`${baseUrl}/users`);
    await page.getByRole('heading', { name: 'Not allowed' }).waitFor();
    expect(await page.getByRole('main').innerText()).toContain('Admin');
    await expect(page.getByRole('cell', { name: 'maren.holt@kestrelfen.example' }).count()).resolves.toBe(0);

    await page.getByTestId('user-menu').click();
    await page.getByTestId('sign-out').click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(`${baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    await page.close();
  }, 60_000);
});
