import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type ModelStatic, type Sequelize } from 'sequelize';

export class AuditEventRecord extends Model<InferAttributes<AuditEventRecord>, InferCreationAttributes<AuditEventRecord>> {
  declare id: CreationOptional<number>;
  declare actorId: number | null;
  declare action: string;
  declare targetType: string;
  declare targetId: string;
  declare details: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
}

/** The append-only `audit_events` table (the database refuses updates and deletes). */
export function defineAuditEventModel(sequelize: Sequelize): ModelStatic<AuditEventRecord> {
  class AuditEvent extends AuditEventRecord {}
  AuditEvent.init(
    {
      id: {
        type: DataTypes.BIGINT,
        autoIncrement: true,
        primaryKey: true,
        get() {
          return Number(this.getDataValue('id'));
        },
      },
      actorId: { type: DataTypes.INTEGER, field: 'actor_id' },
      action: { type: DataTypes.STRING(64), allowNull: false },
      targetType: { type: DataTypes.STRING(32), allowNull: false, field: 'target_type' },
      targetId: { type: DataTypes.STRING(64), allowNull: false, field: 'target_id' },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'audit_events', modelName: 'AuditEvent', updatedAt: false },
  );
  return AuditEvent;
}
