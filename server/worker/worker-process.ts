import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { PROJECT_ROOT } from '../config/config';

/**
 * An analysis worker as a process of its own (what `npm start` runs beside the API, and what a
 * test spawns): an analysis keeps both cores busy and must not slow the API down. Node runs the
 * TypeScript through tsx's loader in the same process, so the child's pid is the worker's own.
 * `environment` adds to this process's environment.
 */
export function spawnWorkerProcess(environment: Record<string, string>): ChildProcess {
  return spawn(process.execPath, ['--import', 'tsx', path.join(PROJECT_ROOT, 'server', 'worker', 'main.ts')], {
    cwd: PROJECT_ROOT,
    env: { ...process.env, ...environment },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
}

/** Asks a worker process to stop (it hands back the job in hand) and waits until it has. */
export function stopWorkerProcess(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
  });
}
