import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type ModelStatic, type Sequelize } from 'sequelize';
import type { AnalysisResult, LogCensus } from '@shared/analysis';
import type { RunState, SignOffDecision, StationGeometryDto, StationName, Verdict } from '@shared/api';

export class RunRecord extends Model<InferAttributes<RunRecord>, InferCreationAttributes<RunRecord>> {
  declare id: CreationOptional<number>;
  declare setupId: number;
  declare profileVersionId: number;
  declare fileSha256: string;
  declare originalName: CreationOptional<string>;
  declare duplicateOf: number | null;
  /** The person who uploaded; null when an upload token did. */
  declare uploadedBy: number | null;
  declare uploadTokenId: CreationOptional<number | null>;
  declare bookingId: CreationOptional<number | null>;
  /** Attempt k of the booking; null when unbooked. */
  declare attempt: CreationOptional<number | null>;
  declare replacementReason: CreationOptional<string | null>;
  declare replayOf: CreationOptional<number | null>;
  declare acquiredOn: string | null;
  declare notes: CreationOptional<string>;
  declare mapping: Record<string, unknown> | null;
  declare seed: string;
  declare state: CreationOptional<RunState>;
  declare progress: CreationOptional<number>;
  declare attempts: CreationOptional<number>;
  /** The worker of the latest attempt, `host:pid`. */
  declare analysedBy: CreationOptional<string | null>;
  declare verdict: CreationOptional<Verdict | null>;
  declare result: CreationOptional<AnalysisResult | null>;
  declare error: CreationOptional<string | null>;
  /** The Ed25519 signature over the stored result (see server/integrity), set with the result. */
  declare signingKeyId: CreationOptional<string | null>;
  declare signedAt: CreationOptional<Date | null>;
  declare signature: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare startedAt: CreationOptional<Date | null>;
  /** Written every WORKER_HEARTBEAT_SECONDS by the worker analysing the run. */
  declare heartbeatAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  /** A run of two station logs: station B's file (`fileSha256` is station A's) and its name. */
  declare stationBSha256: CreationOptional<string | null>;
  declare stationBName: CreationOptional<string | null>;
  /** A shift lead's stated offset k (A's round r with B's round r + k) and why; null: as recorded. */
  declare stationOffset: CreationOptional<number | null>;
  declare offsetReason: CreationOptional<string | null>;
  /** The setup's distance and clock offset when the run was made; null: the timing is not checked. */
  declare stationGeometry: CreationOptional<StationGeometryDto | null>;
  /** The run this one re-runs at a stated offset. */
  declare realignedFrom: CreationOptional<number | null>;
}

/** One station's uploaded log: waiting for the other station's of the night, then joined into a run. */
export class StationLogRecord extends Model<InferAttributes<StationLogRecord>, InferCreationAttributes<StationLogRecord>> {
  declare id: CreationOptional<number>;
  declare setupId: number;
  declare station: StationName;
  declare bookingId: number | null;
  declare acquiredOn: string | null;
  declare fileSha256: string;
  declare originalName: string;
  declare uploadedBy: number | null;
  declare uploadTokenId: number | null;
  declare notes: CreationOptional<string>;
  declare mapping: Record<string, unknown> | null;
  declare runId: CreationOptional<number | null>;
  declare supersededBy: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
}

export class ArchiveFileRecord extends Model<InferAttributes<ArchiveFileRecord>, InferCreationAttributes<ArchiveFileRecord>> {
  declare sha256: string;
  declare bytes: number;
  /** Taken while the upload streamed in, so the analysis needs no counting pass; null for files archived without one. */
  declare census: CreationOptional<LogCensus | null>;
  declare createdAt: CreationOptional<Date>;
}

export class SignOffRecord extends Model<InferAttributes<SignOffRecord>, InferCreationAttributes<SignOffRecord>> {
  declare runId: number;
  declare userId: number;
  declare decision: SignOffDecision;
  declare comment: string;
  declare createdAt: CreationOptional<Date>;
}

export class WithdrawalRecord extends Model<InferAttributes<WithdrawalRecord>, InferCreationAttributes<WithdrawalRecord>> {
  declare runId: number;
  declare userId: number;
  declare reason: string;
  declare createdAt: CreationOptional<Date>;
}

export class MailDeliveryRecord extends Model<InferAttributes<MailDeliveryRecord>, InferCreationAttributes<MailDeliveryRecord>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare recipients: string[];
  declare status: 'sent' | 'failed';
  declare messageId: string | null;
  declare error: string | null;
  declare attemptedAt: CreationOptional<Date>;
}

export interface RunModels {
  Run: ModelStatic<RunRecord>;
  ArchiveFile: ModelStatic<ArchiveFileRecord>;
  SignOff: ModelStatic<SignOffRecord>;
  Withdrawal: ModelStatic<WithdrawalRecord>;
  MailDelivery: ModelStatic<MailDeliveryRecord>;
  StationLog: ModelStatic<StationLogRecord>;
}

/** `runs`, the `archive_files` they read, their sign-offs, withdrawals and verdict-mail deliveries, and the `station_logs` waiting to become runs. */
export function defineRunModels(sequelize: Sequelize): RunModels {
  class Run extends RunRecord {}
  Run.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      setupId: { type: DataTypes.INTEGER, allowNull: false, field: 'setup_id' },
      profileVersionId: { type: DataTypes.INTEGER, allowNull: false, field: 'profile_version_id' },
      fileSha256: { type: DataTypes.CHAR(64), allowNull: false, field: 'file_sha256' },
      originalName: { type: DataTypes.STRING(255), allowNull: false, defaultValue: '', field: 'original_name' },
      duplicateOf: { type: DataTypes.INTEGER, field: 'duplicate_of' },
      uploadedBy: { type: DataTypes.INTEGER, field: 'uploaded_by' },
      uploadTokenId: { type: DataTypes.INTEGER, field: 'upload_token_id' },
      bookingId: { type: DataTypes.INTEGER, field: 'booking_id' },
      attempt: { type: DataTypes.INTEGER },
      replacementReason: { type: DataTypes.TEXT, field: 'replacement_reason' },
      replayOf: { type: DataTypes.INTEGER, field: 'replay_of' },
      acquiredOn: { type: DataTypes.DATEONLY, field: 'acquired_on' },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      mapping: { type: DataTypes.JSONB },
      seed: { type: DataTypes.CHAR(64), allowNull: false },
      state: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
      progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      analysedBy: { type: DataTypes.STRING(255), field: 'analysed_by' },
      verdict: { type: DataTypes.STRING(8) },
      result: { type: DataTypes.JSONB },
      error: { type: DataTypes.TEXT },
      signingKeyId: { type: DataTypes.CHAR(16), field: 'signing_key_id' },
      signedAt: { type: DataTypes.DATE, field: 'signed_at' },
      signature: { type: DataTypes.TEXT },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      startedAt: { type: DataTypes.DATE, field: 'started_at' },
      heartbeatAt: { type: DataTypes.DATE, field: 'heartbeat_at' },
      finishedAt: { type: DataTypes.DATE, field: 'finished_at' },
      stationBSha256: { type: DataTypes.CHAR(64), field: 'station_b_sha256' },
      stationBName: { type: DataTypes.STRING(255), field: 'station_b_name' },
      stationOffset: { type: DataTypes.INTEGER, field: 'station_offset' },
      offsetReason: { type: DataTypes.TEXT, field: 'offset_reason' },
      stationGeometry: { type: DataTypes.JSONB, field: 'station_geometry' },
      realignedFrom: { type: DataTypes.INTEGER, field: 'realigned_from' },
    },
    { sequelize, tableName: 'runs', modelName: 'Run', updatedAt: false },
  );
  class ArchiveFile extends ArchiveFileRecord {}
  ArchiveFile.init(
    {
      sha256: { type: DataTypes.CHAR(64), primaryKey: true },
      bytes: {
        type: DataTypes.BIGINT,
        allowNull: false,
        get() {
          return Number(this.getDataValue('bytes'));
        },
      },
      census: { type: DataTypes.JSONB },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'archive_files', modelName: 'ArchiveFile', updatedAt: false },
  );
  class SignOff extends SignOffRecord {}
  SignOff.init(
    {
      runId: { type: DataTypes.INTEGER, primaryKey: true, field: 'run_id' },
      userId: { type: DataTypes.INTEGER, allowNull: false, field: 'user_id' },
      decision: { type: DataTypes.STRING(20), allowNull: false },
      comment: { type: DataTypes.TEXT, allowNull: false },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'run_sign_offs', modelName: 'SignOff', updatedAt: false },
  );
  class Withdrawal extends WithdrawalRecord {}
  Withdrawal.init(
    {
      runId: { type: DataTypes.INTEGER, primaryKey: true, field: 'run_id' },
      userId: { type: DataTypes.INTEGER, allowNull: false, field: 'user_id' },
      reason: { type: DataTypes.TEXT, allowNull: false },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'run_withdrawals', modelName: 'Withdrawal', updatedAt: false },
  );
  class MailDelivery extends MailDeliveryRecord {}
  MailDelivery.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      runId: { type: DataTypes.INTEGER, allowNull: false, field: 'run_id' },
      recipients: { type: DataTypes.ARRAY(DataTypes.STRING(320)), allowNull: false },
      status: { type: DataTypes.STRING(8), allowNull: false },
      messageId: { type: DataTypes.STRING(255), field: 'message_id' },
      error: { type: DataTypes.TEXT },
      attemptedAt: { type: DataTypes.DATE, field: 'attempted_at' },
    },
    { sequelize, tableName: 'mail_deliveries', modelName: 'MailDelivery', createdAt: 'attemptedAt', updatedAt: false },
  );
  class StationLog extends StationLogRecord {}
  StationLog.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      setupId: { type: DataTypes.INTEGER, allowNull: false, field: 'setup_id' },
      station: { type: DataTypes.CHAR(1), allowNull: false },
      bookingId: { type: DataTypes.INTEGER, field: 'booking_id' },
      acquiredOn: { type: DataTypes.DATEONLY, field: 'acquired_on' },
      fileSha256: { type: DataTypes.CHAR(64), allowNull: false, field: 'file_sha256' },
      originalName: { type: DataTypes.STRING(255), allowNull: false, field: 'original_name' },
      uploadedBy: { type: DataTypes.INTEGER, field: 'uploaded_by' },
      uploadTokenId: { type: DataTypes.INTEGER, field: 'upload_token_id' },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      mapping: { type: DataTypes.JSONB },
      runId: { type: DataTypes.INTEGER, field: 'run_id' },
      supersededBy: { type: DataTypes.INTEGER, field: 'superseded_by' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'station_logs', modelName: 'StationLog', updatedAt: false },
  );
  return { Run, ArchiveFile, SignOff, Withdrawal, MailDelivery, StationLog };
}
