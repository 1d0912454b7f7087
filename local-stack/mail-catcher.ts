import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { PROJECT_ROOT } from '@server/config/config';

/** The local mail catcher (maildev): every mail Bellkeep sends lands in its web inbox. */
export interface MailCatcher {
  smtpUrl: string;
  /** The web inbox; its REST API is under `${inboxUrl}/api`. */
  inboxUrl: string;
  stop(): Promise<void>;
}

const MAILDEV_CLI = path.join(PROJECT_ROOT, 'node_modules', 'maildev', 'dist', 'bin', 'maildev.js');

/**
 * Starts maildev on loopback as a child process (it is ESM-only, and a process of its own keeps
 * its warnings and its memory out of the API) and waits until its inbox answers.
 */
export async function startMailCatcher(smtpPort: number, webPort: number, mailFolder: string): Promise<MailCatcher> {
  const child = spawn(
    process.execPath,
    [MAILDEV_CLI, '--smtp', String(smtpPort), '--ip', '127.0.0.1', '--web', String(webPort), '--web-ip', '127.0.0.1', '--mail-directory', mailFolder, '--silent'],
    { stdio: ['ignore', 'ignore', 'pipe'] },
  );
  let stderr = '';
  child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  const inboxUrl = `http://127.0.0.1:${webPort}`;
  await waitUntilAnswering(`${inboxUrl}/api/healthz`, child, () => stderr);
  return { smtpUrl: `smtp://127.0.0.1:${smtpPort}`, inboxUrl, stop: () => stopChild(child) };
}

async function waitUntilAnswering(url: string, child: ChildProcess, stderr: () => string): Promise<void> {
  const deadline = Date.now() + 15_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) {
      throw new Error(`The mail catcher stopped at start (are its ports taken?): ${stderr().trim()}`);
    }
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // Not listening yet.
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  child.kill();
  throw new Error(`The mail catcher did not answer at ${url} within 15 s.`);
}

function stopChild(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
  });
}
