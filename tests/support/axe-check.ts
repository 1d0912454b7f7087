import fs from 'node:fs';
import path from 'node:path';
import type { AxeResults } from 'axe-core';
import type { Page } from 'playwright-core';

/** axe-core's browser build, read once. */
let axeSource: string | undefined;

/**
 * axe-core's browser build, evaluated in the page rather than added as a script tag: the app's
 * Content-Security-Policy (helmet's `script-src 'self'`) refuses an inline script, and the tests
 * keep that policy on rather than bypass it.
 */
function axeScript(): string {
  axeSource ??= fs.readFileSync(path.join(path.dirname(require.resolve('axe-core')), 'axe.min.js'), 'utf8');
  return axeSource;
}

/** One rule axe-core finds broken, with the elements that break it. */
export interface AxeViolation {
  id: string;
  help: string;
  /** Each element's selector, with axe-core's summary of what to fix. */
  nodes: { target: string; summary: string }[];
}

/** What the page's animations tell (typed here: this file is also type-checked without the DOM's types). */
type PageAnimations = { document: { getAnimations(): { playState: string; effect: { getComputedTiming(): { iterations?: number } } | null }[] } };

/** What the page's fonts tell (typed here for the same reason). */
type PageFonts = { document: { fonts: { ready: Promise<unknown>; status: string } } };

/** Every rule axe-core (its default rules: WCAG 2 A and AA and its best practices) finds broken on the page once its animations are at rest. */
export async function axeViolations(page: Page): Promise<AxeViolation[]> {
  // Colours are read at rest: a dialog opening or a menu closing has ended. Endless animations (an indeterminate progress bar) go on.
  await page.waitForFunction(() =>
    (globalThis as unknown as PageAnimations).document
      .getAnimations()
      .every((animation) => animation.playState !== 'running' || animation.effect?.getComputedTiming().iterations === Infinity),
  );
  // Icon names are read as icons only once the icon font has loaded: before that axe-core takes a ligature such as
  // "more_vert" for visible text and finds it missing from the button's accessible name.
  await page.evaluate(() => (globalThis as unknown as PageFonts).document.fonts.ready.then(() => undefined));
  await page.waitForFunction(() => (globalThis as unknown as PageFonts).document.fonts.status === 'loaded');
  // Inside the page its global object is written `globalThis`: this file is also type-checked without the DOM's types.
  if (!(await page.evaluate(() => 'axe' in globalThis))) await page.evaluate(axeScript());
  return page.evaluate(async () => {
    const { axe } = globalThis as unknown as { axe: { run(): Promise<AxeResults> } };
    const results = await axe.run();
    return results.violations.map((violation) => ({
      id: violation.id,
      help: violation.help,
      nodes: violation.nodes.map((node) => ({ target: node.target.join(' '), summary: node.failureSummary ?? '' })),
    }));
  });
}

/** The violations as a failure message: each rule's id and help, then each element's selector and what to fix. */
export function describeViolations(screen: string, violations: AxeViolation[]): string {
  const lines = violations.flatMap((violation) => [
    `- ${violation.id}: ${violation.help}`,
    ...violation.nodes.map((node) => `    ${node.target}${node.summary ? `\n      ${node.summary.replace(/\n\s*/g, ' ')}` : ''}`),
  ]);
  return `axe-core finds ${violations.length} accessibility ${violations.length === 1 ? 'rule' : 'rules'} broken on ${screen}:\n${lines.join('\n')}`;
}

/** Fails, naming each broken rule and its elements, when axe-core finds any on the page (once its animations are at rest). */
export async function expectNoAxeViolations(page: Page, screen: string): Promise<void> {
  const violations = await axeViolations(page);
  if (violations.length > 0) throw new Error(describeViolations(screen, violations));
}

/** Opens a dialog by `opening` it, fails as `expectNoAxeViolations` does with it open, then closes it with Escape. */
export async function expectDialogWithoutAxeViolations(page: Page, dialogName: string, opening: () => Promise<unknown>): Promise<void> {
  await opening();
  const dialog = page.getByRole('dialog');
  await dialog.waitFor();
  await expectNoAxeViolations(page, dialogName);
  await page.keyboard.press('Escape');
  await dialog.waitFor({ state: 'detached' });
}
