import fs from 'node:fs';
import type { Server } from 'node:http';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { launchChromium } from './chromium';
import { freePort } from './free-port';
import { createTestApp, type TestApp } from './test-app';

/** Where the browser tests leave their screenshots. */
export const SCREENSHOTS = path.join(__dirname, '../../.data/e2e-screenshots');

/** The real app on its own database, served on a free port, with a headless Chromium to use it. */
export interface BrowserSession {
  testApp: TestApp;
  browser: Browser;
  baseUrl: string;
  /** Signs a demo person in on `page`, waiting for the shell. */
  signInOn(page: Page, email: string): Promise<void>;
  /** A new page (1280 × 900 unless told) with a demo person signed in. */
  signIn(email: string, options?: { viewport?: { width: number; height: number }; acceptDownloads?: boolean }): Promise<Page>;
  screenshot(page: Page, name: string): Promise<unknown>;
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
    screenshot: (page, name) => page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true }),
    async close() {
      await browser.close();
      await new Promise((resolve) => server.close(resolve));
      await testApp.close();
    },
  };
}
