import bcrypt from 'bcryptjs';
import type { MigrationContext } from '@server/database/migrate';
import { DEMO_PASSWORD, DEMO_PEOPLE } from './data/demo-people';

/** bcrypt cost for the demo accounts only: cheap, since their password is public anyway. */
const DEMO_BCRYPT_ROUNDS = 8;

/** The demo lab's people; a person whose e-mail is already taken is left as it is. */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, DEMO_BCRYPT_ROUNDS);
  for (const person of DEMO_PEOPLE) {
    await queryInterface.sequelize.query(
      `INSERT INTO users (email, name, password_hash, roles, active, created_at, updated_at)
       VALUES (:email, :name, :passwordHash, ARRAY[:roles]::varchar[], true, now(), now())
       ON CONFLICT ((lower(email))) DO NOTHING`,
      { transaction, replacements: { ...person, passwordHash } },
    );
  }
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.sequelize.query('DELETE FROM users WHERE email IN (:emails)', {
    transaction,
    replacements: { emails: DEMO_PEOPLE.map((person) => person.email) },
  });
}
