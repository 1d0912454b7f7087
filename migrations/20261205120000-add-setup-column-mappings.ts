import type { MigrationContext } from '@server/database/migrate';

/** A setup's saved column mapping: the upload page starts from it, and an upload that names none is read with it. */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE setups ADD COLUMN column_mapping jsonb', { transaction });
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE setups DROP COLUMN column_mapping', { transaction });
}
