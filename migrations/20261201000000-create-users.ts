import { DataTypes } from 'sequelize';
import type { MigrationContext } from '@server/database/migrate';
import { ROLES } from '@shared/api/roles';

/** Users with their roles; e-mail unique regardless of case; at least one known role each. */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.createTable(
    'users',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(320), allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      password_hash: { type: DataTypes.STRING(100), allowNull: false },
      roles: { type: DataTypes.ARRAY(DataTypes.STRING(32)), allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { transaction },
  );
  const knownRoles = ROLES.map((role) => `'${role}'`).join(', ');
  await queryInterface.sequelize.query('CREATE UNIQUE INDEX users_email_lower ON users (lower(email))', { transaction });
  await queryInterface.sequelize.query(
    `ALTER TABLE users ADD CONSTRAINT users_roles_known
       CHECK (cardinality(roles) >= 1 AND roles <@ ARRAY[${knownRoles}]::varchar[])`,
    { transaction },
  );
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  await queryInterface.dropTable('users', { transaction });
}
