import fs from 'node:fs';
import { chromium, type Browser } from 'playwright-core';
import { installDebianPackage } from '@local-stack/debian-package';

const CHROMIUM = '/usr/bin/chromium';

/** Flags that keep headless Chromium quiet on a machine with no network but loopback. */
const CHROMIUM_FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** Installs Debian's Chromium when it is missing (the browser tests' global set-up calls this). */
export function ensureChromium(): void {
  if (!fs.existsSync(CHROMIUM)) installDebianPackage('chromium', 'the end-to-end test');
}

/** Debian's Chromium driven by playwright-core (which downloads no browser of its own). */
export async function launchChromium(): Promise<Browser> {
  ensureChromium();
  return chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_FLAGS });
}
