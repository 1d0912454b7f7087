import type { MigrationContext } from '@server/database/migrate';

/** The analysing worker's heartbeat, so a run whose worker went silent can say it waits for one. */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE runs ADD COLUMN heartbeat_at timestamptz', { transaction });
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE runs DROP COLUMN heartbeat_at', { transaction });
}
