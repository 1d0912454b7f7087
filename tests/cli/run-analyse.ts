import { spawnSync } from 'node:child_process';
import * as path from 'node:path';

/** Repository root. */
export const ROOT = path.resolve(__dirname, '../..');

/** A fixture file's path. */
export function fixture(name: string): string {
  return path.join(ROOT, 'fixtures/logs', name);
}

/** What one run of the command printed and returned. */
export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** Runs `analyse` as a user would (tsx on server/cli/analyse.ts) with the given arguments. */
export function runAnalyse(...args: string[]): CliRun {
  const run = spawnSync(path.join(ROOT, 'node_modules/.bin/tsx'), [path.join(ROOT, 'server/cli/analyse.ts'), ...args], { cwd: ROOT, encoding: 'utf8' });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

/** A fixed seed, so runs can be compared. */
export const SEED = 'a5'.repeat(32);
