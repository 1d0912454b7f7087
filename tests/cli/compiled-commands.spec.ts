import { spawnSync } from 'node:child_process';
import * as path from 'node:path';
import { fixture, ROOT, runAnalyse, SEED } from './run-analyse';

/** Runs `analyse` as `npm run analyse` does: compiled JavaScript, built first when a source changed. */
function runCompiledAnalyse(...args: string[]) {
  const run = spawnSync(process.execPath, [path.join(ROOT, 'server/cli/run-compiled.js'), 'server/cli/analyse.ts', ...args], { cwd: ROOT, encoding: 'utf8' });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

// The first run may compile the sources (a second or two on a loaded machine).
jest.setTimeout(120_000);

describe('the compiled commands', () => {
  it.each([
    ['one thread', '1'],
    ['two threads (the range worker compiled too)', '2'],
  ])('print what the TypeScript prints, with the same exit code (%s)', (_, threads) => {
    const args = [fixture('accepted-run.csv'), '--seed', SEED, '--profile', fixture('observed-profile.json'), '--threads', threads];
    const compiled = runCompiledAnalyse(...args);
    const typescript = runAnalyse(...args);
    expect(compiled.stderr).toContain('verdict: ACCEPT');
    expect(compiled.status).toBe(0);
    expect(compiled.stdout).toBe(typescript.stdout);
  });

  it('refuses a call without a command file, with the usage', () => {
    const run = spawnSync(process.execPath, [path.join(ROOT, 'server/cli/run-compiled.js')], { cwd: ROOT, encoding: 'utf8' });
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('usage: node server/cli/run-compiled.js');
  });
});
