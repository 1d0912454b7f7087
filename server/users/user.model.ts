import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize, type ModelStatic } from 'sequelize';
import type { Role, UserDto } from '@shared/api';

export class UserRecord extends Model<InferAttributes<UserRecord>, InferCreationAttributes<UserRecord>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare passwordHash: string;
  declare roles: Role[];
  declare active: CreationOptional<boolean>;
  /** Raised at each password change: tokens issued under an older version are refused. */
  declare passwordVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export type UserModelStatic = ModelStatic<UserRecord>;

/** The `users` table; its shape is fixed by migrations/, this only maps it. */
export function defineUserModel(sequelize: Sequelize): UserModelStatic {
  // Sequelize's init() binds this class to one connection; a subclass per call keeps each
  // database (tests open several) with its own model.
  class User extends UserRecord {}
  User.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(320), allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      passwordHash: { type: DataTypes.STRING(100), allowNull: false, field: 'password_hash' },
      roles: { type: DataTypes.ARRAY(DataTypes.STRING(32)), allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      passwordVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: 'password_version' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'users', modelName: 'User' },
  );
  return User;
}

export class PasswordResetRecord extends Model<InferAttributes<PasswordResetRecord>, InferCreationAttributes<PasswordResetRecord>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare secretSha256: string;
  declare requestedBy: number;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
}

/** The `password_resets` table: the reset links an admin mailed, by the SHA-256 of their secret. */
export function definePasswordResetModel(sequelize: Sequelize): ModelStatic<PasswordResetRecord> {
  class PasswordReset extends PasswordResetRecord {}
  PasswordReset.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false, field: 'user_id' },
      secretSha256: { type: DataTypes.CHAR(64), allowNull: false, field: 'secret_sha256' },
      requestedBy: { type: DataTypes.INTEGER, allowNull: false, field: 'requested_by' },
      expiresAt: { type: DataTypes.DATE, allowNull: false, field: 'expires_at' },
      usedAt: { type: DataTypes.DATE, allowNull: true, field: 'used_at' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'password_resets', modelName: 'PasswordReset', updatedAt: false },
  );
  return PasswordReset;
}

/** The API's view of a user: never the hash. */
export function toUserDto(user: UserRecord): UserDto {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    roles: [...user.roles],
    active: user.active,
    createdAt: user.createdAt.toISOString(),
  };
}
