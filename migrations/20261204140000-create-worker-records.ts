import type { MigrationContext } from '@server/database/migrate';

/**
 * One row per analysis-worker process that ever started: when it was last seen, and how it ended
 * (stopped when asked, or ended unasked, as its supervisor saw it). A worker that keeps dying, or
 * one that went silent, shows here for the admins.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query(
    `CREATE TABLE worker_records (
       id uuid PRIMARY KEY,
       host varchar(255) NOT NULL,
       pid integer NOT NULL,
       started_at timestamptz NOT NULL DEFAULT now(),
       seen_at timestamptz NOT NULL DEFAULT now(),
       ended_at timestamptz,
       ended_how varchar(200),
       ended_unasked boolean NOT NULL DEFAULT false
     );
     CREATE INDEX worker_records_started_at ON worker_records (started_at DESC);
     CREATE INDEX worker_records_host_pid ON worker_records (host, pid) WHERE ended_at IS NULL;`,
    { transaction },
  );
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('DROP TABLE worker_records', { transaction });
}
