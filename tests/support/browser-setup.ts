import { loadConfig } from '@server/config/config';
import { appBuildIsStale, buildApp } from '@server/system/angular-build';
import setUpTestCluster from './database-setup';
import { ensureChromium } from './chromium';

/**
 * Global set-up of the end-to-end project: the shared test cluster, Debian's Chromium (installed
 * once, before any test file runs: two apt-get runs at once would fight over dpkg's lock) and a
 * current production build of the app (one build, not one per test file).
 */
export default async function setUpBrowserTests(): Promise<void> {
  await setUpTestCluster();
  ensureChromium();
  if (appBuildIsStale(loadConfig().appDir)) await buildApp();
}
