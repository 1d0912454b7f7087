import type { MigrationContext } from '@server/database/migrate';

/**
 * Passwords that change: each user's password version (a bearer token names the version it was
 * issued under, so changing the password ends every other session), and the single-use reset
 * links an admin has mailed (only the SHA-256 of each link's secret is kept).
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
  await run('ALTER TABLE users ADD COLUMN password_version integer NOT NULL DEFAULT 0');
  await run(`
    CREATE TABLE password_resets (
      id serial PRIMARY KEY,
      user_id integer NOT NULL REFERENCES users (id),
      secret_sha256 char(64) NOT NULL UNIQUE,
      requested_by integer NOT NULL REFERENCES users (id),
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
  await run('CREATE INDEX password_resets_user ON password_resets (user_id)');
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('DROP TABLE password_resets', { transaction });
  await queryInterface.sequelize.query('ALTER TABLE users DROP COLUMN password_version', { transaction });
}
