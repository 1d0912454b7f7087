import type { MigrationContext } from '@server/database/migrate';

/**
 * A mistaken upload withdrawn before its sign-off: who withdrew it, when and why. The run, its
 * archived log and its trail stay; a withdrawn run awaits no sign-off and is marked everywhere.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query(
    `CREATE TABLE run_withdrawals (
      run_id integer PRIMARY KEY REFERENCES runs (id),
      user_id integer NOT NULL REFERENCES users (id),
      reason text NOT NULL CHECK (btrim(reason) <> ''),
      created_at timestamptz NOT NULL DEFAULT now()
    )`,
    { transaction },
  );
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('DROP TABLE run_withdrawals', { transaction });
}
