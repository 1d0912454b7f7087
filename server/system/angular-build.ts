import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { PROJECT_ROOT } from '../config/config';

/** What the built app is made from: a change to any of them calls for a new build. */
const APP_SOURCES = ['src', 'shared', 'public', 'angular.json', 'tsconfig.app.json', 'package-lock.json'];

/** Whether the build is missing or older than any of its sources. */
export function appBuildIsStale(appDir: string): boolean {
  const indexFile = path.join(appDir, 'index.html');
  const builtAt = fs.existsSync(indexFile) ? fs.statSync(indexFile).mtimeMs : 0;
  return builtAt <= newestChange(APP_SOURCES.map((source) => path.join(PROJECT_ROOT, source)));
}

/** A production `ng build`, in a child process so the rest of the start goes on meanwhile. */
export function buildApp(): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [ngCli(), 'build', '--configuration', 'production'], { cwd: PROJECT_ROOT, stdio: ['ignore', 'ignore', 'inherit'] });
    child.once('error', reject);
    child.once('exit', (code) => (code === 0 ? resolve() : reject(new Error('ng build failed; its messages are above.'))));
  });
}

/** `ng serve` with the proxy to the API, for `npm run dev`. */
export function startDevServer(): { url: string; stop(): void } {
  const child = spawn(process.execPath, [ngCli(), 'serve', '--port', '4200'], { cwd: PROJECT_ROOT, stdio: 'inherit' });
  return { url: 'http://localhost:4200', stop: () => child.kill('SIGTERM') };
}

function ngCli(): string {
  return path.join(PROJECT_ROOT, 'node_modules', '@angular', 'cli', 'bin', 'ng.js');
}

function newestChange(paths: string[]): number {
  let newest = 0;
  const visit = (entry: string) => {
    if (!fs.existsSync(entry)) return;
    const stat = fs.statSync(entry);
    newest = Math.max(newest, stat.mtimeMs);
    if (stat.isDirectory()) for (const child of fs.readdirSync(entry)) visit(path.join(entry, child));
  };
  paths.forEach(visit);
  return newest;
}
