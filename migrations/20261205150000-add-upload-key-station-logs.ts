import type { MigrationContext } from '@server/database/migrate';

/**
 * An upload key (an `Idempotency-Key`, or a finished resumable upload's id) may stand for a station's
 * log that waits for the other station's, not yet a run: a repeat of that upload, or a client whose
 * last answer was lost, is told of that log instead of sending it again.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE upload_keys ADD COLUMN station_log_id integer REFERENCES station_logs (id) ON DELETE CASCADE', { transaction });
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE upload_keys DROP COLUMN station_log_id', { transaction });
}
