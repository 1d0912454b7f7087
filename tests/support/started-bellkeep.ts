import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PROJECT_ROOT } from '@server/config/config';
import { portAnswers } from '@server/system/port-answers';
import { freePort } from './free-port';

/** `npm start` as a lab runs it, in a process group of its own, on free ports and a data folder of its own. */
export interface Started {
  child: ChildProcess;
  output: () => string;
  baseUrl: string;
  dataDir: string;
  ports: number[];
  waitFor(text: string | RegExp, timeoutMs?: number): Promise<void>;
}

export async function startBellkeep(dataDir: string, extra: Record<string, string> = {}): Promise<Started> {
  const [port, pgPort, smtpPort, webPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
  // A built app of its own (an index.html newer than every source), so the start does not run ng build.
  const appDir = path.join(dataDir, 'app');
  fs.mkdirSync(appDir, { recursive: true });
  fs.writeFileSync(path.join(appDir, 'index.html'), '<!doctype html><title>Bellkeep</title>');
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(PROJECT_ROOT, 'local-stack', 'start.ts')], {
    cwd: PROJECT_ROOT,
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
    env: {
      ...process.env,
      BELLKEEP_DATA_DIR: dataDir,
      BELLKEEP_APP_DIR: appDir,
      BELLKEEP_PORT: String(port),
      BELLKEEP_PG_PORT: String(pgPort),
      BELLKEEP_MAILCATCHER_SMTP_PORT: String(smtpPort),
      BELLKEEP_MAILCATCHER_WEB_PORT: String(webPort),
      BELLKEEP_BCRYPT_ROUNDS: '4',
      BELLKEEP_DEMO_HISTORY: 'false',
      ...extra,
    },
  });
  let output = '';
  child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const waitFor = async (text: string | RegExp, timeoutMs = 90_000) => {
    const deadline = Date.now() + timeoutMs;
    while (!(typeof text === 'string' ? output.includes(text) : text.test(output))) {
      if (Date.now() > deadline) throw new Error(`No "${text}" after ${timeoutMs} ms; the output:\n${output}`);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  };
  return { child, output: () => output, baseUrl: `http://127.0.0.1:${port}`, dataDir, ports: [port, pgPort, smtpPort, webPort], waitFor };
}

/** Waits until none of the ports answers: every process that served them is gone. */
export async function untilClosed(ports: number[], timeoutMs = 40_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const open = [];
    for (const port of ports) if (await portAnswers('127.0.0.1', port)) open.push(port);
    if (open.length === 0) return;
    if (Date.now() > deadline) throw new Error(`Ports still answering after ${timeoutMs} ms: ${open.join(', ')}`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

/** The processes whose command line names this data folder (the cluster and its guardian). */
export function processesOf(dataDir: string): string[] {
  const found = spawnSync('pgrep', ['-af', dataDir], { encoding: 'utf8' }).stdout.trim();
  return found === '' ? [] : found.split('\n');
}

export async function api<T>(baseUrl: string, route: string, init: RequestInit & { token?: string } = {}): Promise<T> {
  const response = await fetch(`${baseUrl}${route}`, {
    ...init,
    headers: {
      ...(init.token ? { Authorization: `Bearer ${init.token}` } : {}),
      ...(init.body && typeof init.body === 'string' ? { 'Content-Type': 'application/json' } : {}),
      ...init.headers,
    },
  });
  if (!response.ok) throw new Error(`${init.method ?? 'GET'} ${route}: ${response.status} ${await response.text()}`);
  return (await response.json()) as T;
}

/** A private data folder for one start, which `postgres` may enter (as root the cluster runs as that user). */
export function startFolder(): string {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-started-'));
  fs.chmodSync(folder, 0o755);
  return folder;
}

/**
 * `pg_ctl restart -m fast` on a started Bellkeep's own cluster (as `postgres` when we are root).
 * The server's output goes to its log file: a server that inherited our pipes would keep
 * spawnSync waiting for them to close.
 */
export function restartCluster(dataDir: string): void {
  const root = '/usr/lib/postgresql';
  const major = fs.readdirSync(root).sort((a, b) => Number(b) - Number(a))[0];
  const folder = path.join(dataDir, 'postgres');
  const command = [path.join(root, major, 'bin', 'pg_ctl'), 'restart', '-m', 'fast', '-w', '-D', path.join(folder, 'cluster'), '-l', path.join(folder, 'server.log')];
  const asRoot = process.getuid?.() === 0;
  const outcome = spawnSync(asRoot ? 'runuser' : command[0], asRoot ? ['-u', 'postgres', '--', ...command] : command.slice(1), { stdio: 'ignore', timeout: 60_000 });
  if (outcome.status !== 0) throw new Error(`pg_ctl restart of ${folder} failed (status ${outcome.status}); see ${path.join(folder, 'server.log')}`);
}
