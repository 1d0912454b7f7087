import type { StationName } from '@shared/api';
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type ModelStatic, type Sequelize } from 'sequelize';

export class UploadTokenRecord extends Model<InferAttributes<UploadTokenRecord>, InferCreationAttributes<UploadTokenRecord>> {
  declare id: CreationOptional<number>;
  declare setupId: number;
  declare name: string;
  /** SHA-256 of the token, hex; the token itself is shown once and never stored. */
  declare tokenHash: string;
  declare createdBy: number;
  declare expiresAt: Date;
  declare revokedAt: CreationOptional<Date | null>;
  declare revokedBy: CreationOptional<number | null>;
  declare lastUsedAt: CreationOptional<Date | null>;
  /** The station whose computer holds the token: it uploads that station's log only; null: joined logs. */
  declare station: CreationOptional<StationName | null>;
  declare createdAt: CreationOptional<Date>;
}

/** `upload_tokens`: the acquisition computer's per-setup tokens. */
export function defineUploadTokenModel(sequelize: Sequelize): ModelStatic<UploadTokenRecord> {
  class UploadToken extends UploadTokenRecord {}
  UploadToken.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      setupId: { type: DataTypes.INTEGER, allowNull: false, field: 'setup_id' },
      name: { type: DataTypes.STRING(120), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, field: 'token_hash' },
      createdBy: { type: DataTypes.INTEGER, allowNull: false, field: 'created_by' },
      expiresAt: { type: DataTypes.DATE, allowNull: false, field: 'expires_at' },
      revokedAt: { type: DataTypes.DATE, field: 'revoked_at' },
      revokedBy: { type: DataTypes.INTEGER, field: 'revoked_by' },
      lastUsedAt: { type: DataTypes.DATE, field: 'last_used_at' },
      station: { type: DataTypes.CHAR(1) },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'upload_tokens', modelName: 'UploadToken', updatedAt: false },
  );
  return UploadToken;
}
