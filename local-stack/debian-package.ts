import { spawnSync } from 'node:child_process';
import fs from 'node:fs';

/**
 * Installs a Debian package with apt-get when running as root; otherwise stops with a sentence
 * telling the person what to install. `why` says what the package is for.
 */
export function installDebianPackage(packageName: string, why: string): void {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot) {
    throw new Error(`${why} needs Debian's '${packageName}' package, which is not installed. ` + `Install it (sudo apt-get install -y ${packageName}) and start again.`);
  }
  if (packageName === 'postgresql') preventDefaultPostgresCluster();
  process.stderr.write(`Installing Debian's ${packageName} for ${why} (apt-get, about a minute)...\n`);
  const environment = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [['update'], ['install', '-y', '--no-install-recommends', packageName]]) {
    const outcome = spawnSync('apt-get', args, { stdio: ['ignore', 'ignore', 'inherit'], env: environment });
    if (outcome.status !== 0) {
      throw new Error(`apt-get ${args.join(' ')} failed (exit ${outcome.status}); ${why} cannot go on.`);
    }
  }
}

/**
 * Debian's postgresql package creates and starts a system-wide cluster on port 5432 unless told
 * not to; Bellkeep runs its own cluster, so it asks postgresql-common not to create that one.
 */
function preventDefaultPostgresCluster(): void {
  const file = '/etc/postgresql-common/createcluster.conf';
  if (fs.existsSync(file)) return;
  fs.mkdirSync('/etc/postgresql-common', { recursive: true });
  fs.writeFileSync(file, 'create_main_cluster = false\n');
}
