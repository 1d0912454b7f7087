import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type ModelStatic, type Sequelize } from 'sequelize';
import type { AnalysisResult } from '@shared/analysis';
import type { FieldDifference, ReverificationState } from '@shared/api';

export class SigningKeyRecord extends Model<InferAttributes<SigningKeyRecord>, InferCreationAttributes<SigningKeyRecord>> {
  declare keyId: string;
  declare publicKeyPem: string;
  declare createdAt: CreationOptional<Date>;
  declare retiredAt: CreationOptional<Date | null>;
}

export class ReverificationRecord extends Model<InferAttributes<ReverificationRecord>, InferCreationAttributes<ReverificationRecord>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare requestedBy: number;
  /** Another seed than the run's: an admin's re-analysis, which never replaces the verdict. */
  declare seed: CreationOptional<string | null>;
  declare state: CreationOptional<ReverificationState>;
  declare storedFingerprint: string;
  declare storedEngineVersion: string;
  declare newFingerprint: CreationOptional<string | null>;
  declare newEngineVersion: CreationOptional<string | null>;
  declare result: CreationOptional<AnalysisResult | null>;
  declare differences: CreationOptional<FieldDifference[]>;
  declare differenceCount: CreationOptional<number>;
  declare attempts: CreationOptional<number>;
  declare error: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
}

export interface IntegrityModels {
  SigningKey: ModelStatic<SigningKeyRecord>;
  Reverification: ModelStatic<ReverificationRecord>;
}

/** `signing_keys` and `run_reverifications`. */
export function defineIntegrityModels(sequelize: Sequelize): IntegrityModels {
  class SigningKey extends SigningKeyRecord {}
  SigningKey.init(
    {
      keyId: { type: DataTypes.CHAR(16), primaryKey: true, field: 'key_id' },
      publicKeyPem: { type: DataTypes.TEXT, allowNull: false, field: 'public_key_pem' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      retiredAt: { type: DataTypes.DATE, field: 'retired_at' },
    },
    { sequelize, tableName: 'signing_keys', modelName: 'SigningKey', updatedAt: false },
  );
  class Reverification extends ReverificationRecord {}
  Reverification.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      runId: { type: DataTypes.INTEGER, allowNull: false, field: 'run_id' },
      requestedBy: { type: DataTypes.INTEGER, allowNull: false, field: 'requested_by' },
      seed: { type: DataTypes.CHAR(64) },
      state: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
      storedFingerprint: { type: DataTypes.CHAR(64), allowNull: false, field: 'stored_fingerprint' },
      storedEngineVersion: { type: DataTypes.STRING(32), allowNull: false, field: 'stored_engine_version' },
      newFingerprint: { type: DataTypes.CHAR(64), field: 'new_fingerprint' },
      newEngineVersion: { type: DataTypes.STRING(32), field: 'new_engine_version' },
      result: { type: DataTypes.JSONB },
      differences: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      differenceCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: 'difference_count' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      error: { type: DataTypes.TEXT },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      startedAt: { type: DataTypes.DATE, field: 'started_at' },
      finishedAt: { type: DataTypes.DATE, field: 'finished_at' },
    },
    { sequelize, tableName: 'run_reverifications', modelName: 'Reverification', updatedAt: false },
  );
  return { SigningKey, Reverification };
}
