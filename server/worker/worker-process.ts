import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { PROJECT_ROOT } from '../config/config';
import { withEngineMemory } from '@shared/analysis/node';

/** What a worker prints once it takes jobs (server/worker/main.ts). */
export const TAKING_JOBS = 'is taking analysis jobs';

/**
 * An analysis worker as a process of its own (what `npm start` runs beside the API, and what a
 * test spawns): an analysis keeps both cores busy and must not slow the API down. It runs the
 * worker's compiled bundle (server/cli/run-compiled.js builds it when a source is newer) in the
 * same process, so the child's pid is the worker's own.
 * `environment` adds to this process's environment, and the engine's allocator settings are set
 * (see engine-memory.ts). Its output goes on to this process's.
 */
export function spawnWorkerProcess(environment: Record<string, string>): ChildProcess {
  const child = spawn(process.execPath, [path.join(PROJECT_ROOT, 'server', 'cli', 'run-compiled.js'), 'server/worker/main.ts'], {
    cwd: PROJECT_ROOT,
    env: withEngineMemory({ ...process.env, ...environment }),
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  child.stdout.pipe(process.stdout, { end: false });
  return child;
}

/** Resolves once a spawned worker says it takes jobs; rejects if it exits first. */
export function untilTakingJobs(child: ChildProcess): Promise<void> {
  return new Promise((resolve, reject) => {
    let said = '';
    const listen = (chunk: Buffer) => {
      said += chunk.toString();
      if (!said.includes(TAKING_JOBS)) return;
      child.stdout!.off('data', listen);
      child.off('exit', exited);
      resolve();
    };
    const exited = () => reject(new Error(`Worker ${child.pid} exited before it took jobs.`));
    child.stdout!.on('data', listen);
    child.once('exit', exited);
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
