import type { Config } from '../config/config';
import { createAuditTrail } from '../audit/audit-trail';
import { resolveSigningKey } from '../integrity/signing-key';
import { createSigningKeysService } from '../integrity/signing-keys.service';
import { createLogStore } from '../storage/create-log-store';
import { createUsersService } from '../users/users.service';
import { migrate, seedDemo, seedDemoHistory } from './migrate';
import type { Database } from './sequelize';

export interface BootstrapReport {
  migrations: string[];
  seeders: string[];
  createdAdmin?: string;
}

/**
 * Brings a database up to date on start: migrations, this process's signing key, the demo lab when asked for, and a first
 * admin when there is none (from BELLKEEP_ADMIN_*, or else the demo lab's admin); with
 * `history`, also the demo lab's analysed nightly runs.
 */
export async function bootstrapDatabase(database: Database, config: Config, options: { history: boolean } = { history: false }): Promise<BootstrapReport> {
  const migrations = await migrate(database.sequelize);
  const audit = createAuditTrail(database.models.AuditEvent);
  const signingKeys = createSigningKeysService(database.sequelize, database.models, audit, resolveSigningKey(config.signingKey, config.dataDir));
  await signingKeys.register();
  const users = createUsersService(database.models.User, config.bcryptRounds, audit);
  let createdAdmin: string | undefined;
  if ((await users.countActiveAdmins()) === 0 && config.bootstrapAdmin) {
    const admin = await users.create({ ...config.bootstrapAdmin, roles: ['admin'] }, null);
    createdAdmin = admin.email;
  }
  const needsDemoAdmin = (await users.countActiveAdmins()) === 0;
  const seeders = config.demo || needsDemoAdmin ? await seedDemo(database.sequelize) : [];
  if (options.history) seeders.push(...(await seedHistory(database, config)));
  return { migrations, seeders, createdAdmin };
}

/**
 * The demo lab's analysed nightly runs, when BELLKEEP_DEMO asks for the demo (once: a seeded
 * history is not seeded again). `onProgress` hears of each night analysed.
 */
export async function seedHistory(database: Database, config: Config, onProgress?: (done: number, total: number) => void): Promise<string[]> {
  if (!config.demo) return [];
  return seedDemoHistory(database.sequelize, { logStore: createLogStore(config), signingKey: resolveSigningKey(config.signingKey, config.dataDir), progress: onProgress });
}
