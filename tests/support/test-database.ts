import crypto from 'node:crypto';
import { Client } from 'pg';
import { openDatabase, type Database } from '@server/database/sequelize';
import { TEMPLATE_DATABASE } from './database-setup';

export interface TestDatabase extends Database {
  url: string;
  /** Closes the pool and drops the database. */
  drop(): Promise<void>;
}

/** A fresh, migrated database of its own for one test file: a copy of the template. */
export async function createTestDatabase(): Promise<TestDatabase> {
  const maintenanceUrl = process.env['BELLKEEP_TEST_CLUSTER_URL'];
  if (!maintenanceUrl) throw new Error('BELLKEEP_TEST_CLUSTER_URL is unset: run this test through jest (its global set-up starts PostgreSQL).');
  const name = `test_${crypto.randomBytes(6).toString('hex')}`;
  await maintenance(maintenanceUrl, `CREATE DATABASE ${name} TEMPLATE ${TEMPLATE_DATABASE}`);
  const url = maintenanceUrl.replace(/\/postgres$/, `/${name}`);
  const database = openDatabase(url);
  return {
    ...database,
    url,
    drop: async () => {
      await database.close();
      await maintenance(maintenanceUrl, `DROP DATABASE ${name} WITH (FORCE)`);
    },
  };
}

async function maintenance(url: string, statement: string): Promise<void> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(statement);
  } finally {
    await client.end();
  }
}
