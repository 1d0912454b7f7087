import type { MigrationContext } from '@server/database/migrate';

/**
 * Idempotency keys of uploads: a repeated upload request with the same `Idempotency-Key` (a double
 * click, a client's retry) makes one run. A key is claimed before the bytes are read and points at
 * its run once the run exists; a failed upload gives its key back.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query(
    `CREATE TABLE upload_keys (
      user_id integer NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      idempotency_key varchar(200) NOT NULL,
      run_id integer REFERENCES runs (id) ON DELETE CASCADE,
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (user_id, idempotency_key)
    )`,
    { transaction },
  );
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('DROP TABLE upload_keys', { transaction });
}
