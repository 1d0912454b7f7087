import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type ModelStatic, type Sequelize } from 'sequelize';

export class WorkerRecord extends Model<InferAttributes<WorkerRecord>, InferCreationAttributes<WorkerRecord>> {
  declare id: string;
  declare host: string;
  declare pid: number;
  declare startedAt: CreationOptional<Date>;
  /** The worker's last heartbeat. */
  declare seenAt: CreationOptional<Date>;
  declare endedAt: CreationOptional<Date | null>;
  /** How it ended, in words: "stopped when asked", "killed (SIGKILL)", "exit code 1". */
  declare endedHow: CreationOptional<string | null>;
  /** Ended without being asked to: killed, crashed, out of memory. */
  declare endedUnasked: CreationOptional<boolean>;
}

/** `worker_records`: every analysis-worker process that started, and how it ended. */
export function defineWorkerRecordModel(sequelize: Sequelize): ModelStatic<WorkerRecord> {
  class WorkerRecordModel extends WorkerRecord {}
  WorkerRecordModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      host: { type: DataTypes.STRING(255), allowNull: false },
      pid: { type: DataTypes.INTEGER, allowNull: false },
      startedAt: { type: DataTypes.DATE, field: 'started_at' },
      seenAt: { type: DataTypes.DATE, field: 'seen_at' },
      endedAt: { type: DataTypes.DATE, field: 'ended_at' },
      endedHow: { type: DataTypes.STRING(200), field: 'ended_how' },
      endedUnasked: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false, field: 'ended_unasked' },
    },
    { sequelize, tableName: 'worker_records', modelName: 'WorkerRecord', timestamps: false },
  );
  return WorkerRecordModel;
}
