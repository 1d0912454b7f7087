import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { PROJECT_ROOT } from '@server/config/config';

/** The environment variable that tells a harness where its small disk is mounted. */
export const SMALL_DISK_VARIABLE = 'SMALL_DISK_FOLDER';

/**
 * Runs a TypeScript harness in a child process that has a tmpfs of `sizeBytes` mounted at an
 * empty folder (named in SMALL_DISK_FOLDER), and returns what it printed. The child gets a user
 * and mount namespace of its own (util-linux `unshare`, no root needed where unprivileged user
 * namespaces are allowed), so the mount is private to it and goes away when it ends. The child
 * shares the network: it reaches the test cluster through the environment as jest set it up.
 */
export async function runOnSmallDisk(harness: string, sizeBytes: number, timeoutMs: number): Promise<string> {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-small-disk-'));
  try {
    const { stdout } = await promisify(execFile)(
      'unshare',
      ['--user', '--map-root-user', '--mount', '--', 'sh', '-c', `mount -t tmpfs -o size=${sizeBytes} tmpfs "$${SMALL_DISK_VARIABLE}" && exec node --import tsx "$HARNESS"`],
      { cwd: PROJECT_ROOT, env: { ...process.env, [SMALL_DISK_VARIABLE]: folder, HARNESS: harness }, timeout: timeoutMs, maxBuffer: 16 << 20 },
    );
    return stdout;
  } finally {
    fs.rmSync(folder, { recursive: true, force: true });
  }
}
