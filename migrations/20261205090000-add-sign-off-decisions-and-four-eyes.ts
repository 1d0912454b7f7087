import type { MigrationContext } from '@server/database/migrate';

/**
 * A sign-off names its decision (key kept, key discarded, hardware action needed), and each setup
 * its four-eyes rule (whoever uploaded a run may not sign it off; on unless an admin turns it off).
 * Sign-offs made before say what their verdict allowed: an ACCEPT with a key kept it, any other run not.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
  await run('ALTER TABLE setups ADD COLUMN four_eyes boolean NOT NULL DEFAULT true');
  await run('ALTER TABLE run_sign_offs ADD COLUMN decision varchar(20)');
  await run(
    `UPDATE run_sign_offs o SET decision = CASE WHEN r.verdict = 'ACCEPT' AND (r.result #>> '{key,finiteKeyBits}')::float8 > 0 THEN 'key-kept' ELSE 'key-discarded' END FROM runs r WHERE r.id = o.run_id`,
  );
  await run('ALTER TABLE run_sign_offs ALTER COLUMN decision SET NOT NULL');
  await run(`ALTER TABLE run_sign_offs ADD CONSTRAINT run_sign_offs_decision_known CHECK (decision IN ('key-kept', 'key-discarded', 'hardware-action'))`);
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE run_sign_offs DROP COLUMN decision', { transaction });
  await queryInterface.sequelize.query('ALTER TABLE setups DROP COLUMN four_eyes', { transaction });
}
