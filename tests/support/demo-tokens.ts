import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import type { TestApp } from './test-app';

/** The invented lab's people as the API specs call them: by first name in lower case. */
const DEMO_EMAILS = {
  dev: 'dev.okafor@kestrelfen.example',
  lucia: 'lucia.brandt@kestrelfen.example',
  sami: 'sami.virtanen@kestrelfen.example',
  ada: 'ada.reyes@kestrelfen.example',
  maren: 'maren.holt@kestrelfen.example',
} as const;

export type DemoPerson = keyof typeof DEMO_EMAILS;

/** Signs each of `people` in with the demo password; their bearer tokens by name. */
export async function demoTokens(testApp: TestApp, people: readonly DemoPerson[]): Promise<Record<string, string>> {
  const tokens: Record<string, string> = {};
  for (const who of people) tokens[who] = await testApp.signIn(DEMO_EMAILS[who], DEMO_PASSWORD);
  return tokens;
}
