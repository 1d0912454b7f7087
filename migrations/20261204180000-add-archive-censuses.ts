import type { MigrationContext } from '@server/database/migrate';

/**
 * The census of each archived log (lines, records, and marks every few MiB of its text), taken
 * while the upload streamed in, so the worker's analysis reads the log once. Files archived
 * before have none, and their analysis counts for itself.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE archive_files ADD COLUMN census jsonb', { transaction });
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE archive_files DROP COLUMN census', { transaction });
}
