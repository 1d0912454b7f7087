import { spawn } from 'node:child_process';
import path from 'node:path';
import { PROJECT_ROOT } from '../config/config';

/**
 * An analysis worker as a process of its own beside the API (what `npm start` runs): an analysis
 * keeps both cores busy and must not slow the API down. `environment` adds to this process's own.
 */
export function startWorkerProcess(environment: Record<string, string>): { pid: number | undefined; stop(): Promise<void> } {
  const tsx = path.join(PROJECT_ROOT, 'node_modules', 'tsx', 'dist', 'cli.mjs');
  const child = spawn(process.execPath, [tsx, path.join(PROJECT_ROOT, 'server', 'worker', 'main.ts')], {
    cwd: PROJECT_ROOT,
    env: { ...process.env, ...environment },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  return {
    pid: child.pid,
    stop: () =>
      new Promise((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}
