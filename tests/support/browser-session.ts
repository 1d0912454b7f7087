import fs from 'node:fs';
import type { Server } from 'node:http';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { expectDialogWithoutAxeViolations, expectNoAxeViolations } from './axe-check';
import { launchChromium } from './chromium';
import { freePort } from './free-port';
import { createTestApp, type TestApp } from './test-app';

/** Where the browser tests leave their screenshots. */
export const SCREENSHOTS = path.join(__dirname, '../../.data/e2e-screenshots');

/**
 * In the page: how tall the window must be to show the shell's content pane whole (0 without the
 * shell). Written as text because this file is also type-checked without the DOM's types.
 */
const PANE_HEIGHT = `(() => {
  const pane = document.querySelector('.mat-sidenav-content');
  return pane === null ? 0 : Math.ceil(pane.getBoundingClientRect().top + pane.scrollHeight);
})()`;

/** In the page: waits for the next frame, so charts have redrawn at a new window size. */
const NEXT_FRAME = 'new Promise((resolve) => requestAnimationFrame(resolve))';

/** The real app on its own database, served on a free port, with a headless Chromium to use it. */
export interface BrowserSession {
  testApp: TestApp;
  browser: Browser;
  baseUrl: string;
  /** Signs a demo person in on `page`, waiting for the shell. */
  signInOn(page: Page, email: string): Promise<void>;
  /** A new page (1280 × 900 unless told) with a demo person signed in. */
  signIn(email: string, options?: { viewport?: { width: number; height: number }; acceptDownloads?: boolean }): Promise<Page>;
  /** A picture of the whole page (its scrolling content pane unrolled) in .data/e2e-screenshots/`name`.png. */
  screenshot(page: Page, name: string): Promise<unknown>;
  /** Fails, naming each broken rule and its elements, when axe-core finds accessibility problems on `page` as it is now (`screen` names it in the failure). */
  expectNoAxeViolations(page: Page, screen: string): Promise<void>;
  /** Opens a dialog by `opening` it, fails as `expectNoAxeViolations` does with it open, then closes it with Escape. */
  expectDialogWithoutAxeViolations(page: Page, dialogName: string, opening: () => Promise<unknown>): Promise<void>;
  close(): Promise<void>;
}

/** Starts a browser session; `worker` starts an analysis worker too. Mails link to the served address. */
export async function startBrowserSession(options: { worker: boolean }): Promise<BrowserSession> {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const testApp = await createTestApp({ BELLKEEP_PUBLIC_URL: baseUrl });
  if (options.worker) await testApp.startWorker();
  const server: Server = testApp.app.listen(port, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const browser = await launchChromium();
  fs.mkdirSync(SCREENSHOTS, { recursive: true });

  const signInOn = async (page: Page, email: string) => {
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('user-menu').waitFor();
  };

  return {
    testApp,
    browser,
    baseUrl,
    signInOn,
    async signIn(email, pageOptions = {}) {
      const page = await browser.newPage({ viewport: pageOptions.viewport ?? { width: 1280, height: 900 }, acceptDownloads: pageOptions.acceptDownloads ?? false });
      await signInOn(page, email);
      return page;
    },
    async screenshot(page, name) {
      // The signed-in pages scroll inside the shell's content pane, which a full-page screenshot
      // does not unroll: the window grows to the pane's height for the picture, then shrinks back.
      const viewport = page.viewportSize();
      const paneHeight = Number(await page.evaluate(PANE_HEIGHT));
      const grow = viewport !== null && paneHeight > viewport.height;
      if (grow) {
        await page.setViewportSize({ width: viewport.width, height: paneHeight });
        await page.evaluate(NEXT_FRAME);
      }
      try {
        return await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true });
      } finally {
        if (grow) await page.setViewportSize(viewport);
      }
    },
    expectNoAxeViolations,
    expectDialogWithoutAxeViolations,
    async close() {
      await browser.close();
      await new Promise((resolve) => server.close(resolve));
      await testApp.close();
    },
  };
}
