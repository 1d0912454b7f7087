import type { MigrationContext } from '@server/database/migrate';

/**
 * Where a setup's stations are in space and time, for the timing check of two station logs: the
 * straight-line distance between them, and the offset of station B's clock from A's with its
 * uncertainty (as the lab's clock comparison measured them). Each may stay unknown (null).
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
  await run('ALTER TABLE setups ADD COLUMN station_distance_m double precision CHECK (station_distance_m > 0)');
  await run('ALTER TABLE setups ADD COLUMN clock_offset_ns double precision');
  await run('ALTER TABLE setups ADD COLUMN clock_uncertainty_ns double precision CHECK (clock_uncertainty_ns >= 0)');
  await run('ALTER TABLE setups ADD CONSTRAINT setups_clock_offset_with_uncertainty CHECK ((clock_offset_ns IS NULL) = (clock_uncertainty_ns IS NULL))');
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
  await run('ALTER TABLE setups DROP CONSTRAINT setups_clock_offset_with_uncertainty');
  for (const column of ['station_distance_m', 'clock_offset_ns', 'clock_uncertainty_ns']) await run(`ALTER TABLE setups DROP COLUMN ${column}`);
}
