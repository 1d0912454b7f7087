import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { PROJECT_ROOT } from '@server/config/config';
import { stopWorkerProcess } from '@server/worker/worker-process';
import { withEngineMemory } from '@shared/analysis/node';

const START_TIMEOUT_MS = 60_000;

export interface BellkeepProcess {
  pid: number;
  /** Peak resident memory so far (VmHWM), in MB (2^20 bytes), threads included. */
  peakMemoryMB(): number;
  /** SIGTERM, then waits for the exit. */
  stop(): Promise<void>;
}

/**
 * Starts one of Bellkeep's entry points (`server/api-main.ts`, `server/worker/main.ts`) as a
 * process of its own, so its memory is its own, with exactly `environment` added to this one's.
 * Unlike `spawnWorkerProcess` it reads the child's output: it resolves once the child prints
 * `readyLine`, and a child that exits first fails with what it wrote to stderr. With a
 * `profileFolder`, Node writes the child's CPU profile there when it exits.
 */
export async function startBellkeepProcess(entry: string, environment: Record<string, string>, readyLine: RegExp, profileFolder: string | undefined): Promise<BellkeepProcess> {
  const profiling = profileFolder === undefined ? [] : ['--cpu-prof', `--cpu-prof-dir=${profileFolder}`];
  // Compiled, as `npm run api` and `npm run worker` run them.
  const child = spawn(process.execPath, [...profiling, path.join(PROJECT_ROOT, 'server', 'cli', 'run-compiled.js'), entry], {
    cwd: PROJECT_ROOT,
    env: withEngineMemory({ ...process.env, ...environment }),
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let stderr = '';
  child.stderr.on('data', (chunk: Buffer) => {
    stderr += chunk.toString();
    process.stderr.write(`  [${path.basename(entry)}] ${chunk.toString()}`);
  });
  await new Promise<void>((resolve, reject) => {
    let stdout = '';
    let ready = false;
    const timer = setTimeout(() => {
      child.kill('SIGTERM');
      reject(new Error(`${entry} was not ready within ${START_TIMEOUT_MS / 1000} s. ${stderr.trim()}`));
    }, START_TIMEOUT_MS);
    // Read on after the ready line too, so a full pipe never blocks the child.
    child.stdout.on('data', (chunk: Buffer) => {
      if (ready) return;
      stdout += chunk.toString();
      if (readyLine.test(stdout)) {
        ready = true;
        clearTimeout(timer);
        resolve();
      }
    });
    child.once('exit', (code, signal) => {
      clearTimeout(timer);
      reject(new Error(`${entry} stopped at start (${signal ?? `exit ${code}`}): ${stderr.trim()}`));
    });
  });
  // Stopping takes the same SIGTERM a worker takes from `npm start`.
  return { pid: child.pid!, peakMemoryMB: () => peakMemoryMB(child.pid!), stop: () => stopWorkerProcess(child) };
}

/** VmHWM of /proc/<pid>/status: the high-water mark of the resident set, in MB. */
function peakMemoryMB(pid: number): number {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  const match = /^VmHWM:\s+(\d+) kB$/m.exec(status);
  if (!match) throw new Error(`No VmHWM in /proc/${pid}/status`);
  return Number(match[1]) / 1024;
}
