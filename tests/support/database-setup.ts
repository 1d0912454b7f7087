import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import PgBoss from 'pg-boss';
import { migrate } from '@server/database/migrate';
import { startPostgresCluster, type RunningCluster } from '@local-stack/postgres-cluster';
import { openDatabase } from '@server/database/sequelize';
import { freePort } from './free-port';

/** Every test database is a copy of this one, migrated once per jest run. */
export const TEMPLATE_DATABASE = 'bellkeep_template';

interface SharedCluster {
  cluster: RunningCluster;
  folder: string;
  users: number;
}

const holder = globalThis as typeof globalThis & { bellkeepTestCluster?: SharedCluster };

/**
 * Jest global set-up of the projects that need PostgreSQL: one throwaway cluster on a free
 * loopback port in a temporary folder, shared by every such project of the run (counted, so the
 * last teardown stops it). Test files reach it through BELLKEEP_TEST_CLUSTER_URL.
 */
export default async function setUpTestCluster(): Promise<void> {
  if (holder.bellkeepTestCluster) {
    holder.bellkeepTestCluster.users += 1;
    return;
  }
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-test-pg-'));
  // mkdtemp makes the folder private; as root the cluster runs as `postgres`, which must enter it.
  fs.chmodSync(folder, 0o755);
  const cluster = await startPostgresCluster({ folder, port: await freePort(), database: TEMPLATE_DATABASE });
  const template = openDatabase(cluster.url);
  try {
    await migrate(template.sequelize);
    // The queue's own schema too, so no test file waits for pg-boss to install it.
    await template.sequelize.query(PgBoss.getConstructionPlans());
  } finally {
    await template.close();
  }
  holder.bellkeepTestCluster = { cluster, folder, users: 1 };
  process.env['BELLKEEP_TEST_CLUSTER_URL'] = cluster.urlFor('postgres');
}

/** Stops the cluster after its last user, and deletes its folder. */
export function releaseTestCluster(): void {
  const shared = holder.bellkeepTestCluster;
  if (!shared) return;
  shared.users -= 1;
  if (shared.users > 0) return;
  shared.cluster.stop();
  fs.rmSync(shared.folder, { recursive: true, force: true });
  holder.bellkeepTestCluster = undefined;
}
