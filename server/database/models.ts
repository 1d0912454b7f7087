import type { ModelStatic, Sequelize } from 'sequelize';
import { defineAuditEventModel, type AuditEventRecord } from '../audit/audit-event.model';
import { defineBookingModel, type BookingRecord } from '../bookings/booking.model';
import { defineIntegrityModels, type IntegrityModels } from '../integrity/integrity.model';
import { defineProfileModels, type ProfileModels } from '../profiles/profile.model';
import { defineRunModels, type RunModels } from '../runs/run.model';
import { defineSetupModels, type SetupModels } from '../setups/setup.model';
import { defineUploadTokenModel, type UploadTokenRecord } from '../upload-tokens/upload-token.model';
import { definePasswordResetModel, defineUserModel, type PasswordResetRecord, type UserModelStatic } from '../users/user.model';
import { defineWorkerRecordModel, type WorkerRecord } from '../workers/worker-record.model';

export interface Models extends ProfileModels, SetupModels, RunModels, IntegrityModels {
  User: UserModelStatic;
  PasswordReset: ModelStatic<PasswordResetRecord>;
  AuditEvent: ModelStatic<AuditEventRecord>;
  Booking: ModelStatic<BookingRecord>;
  UploadToken: ModelStatic<UploadTokenRecord>;
  WorkerRecord: ModelStatic<WorkerRecord>;
}

/** Every Sequelize model of the app, defined in one place. */
export function defineModels(sequelize: Sequelize): Models {
  return {
    User: defineUserModel(sequelize),
    PasswordReset: definePasswordResetModel(sequelize),
    AuditEvent: defineAuditEventModel(sequelize),
    Booking: defineBookingModel(sequelize),
    UploadToken: defineUploadTokenModel(sequelize),
    WorkerRecord: defineWorkerRecordModel(sequelize),
    ...defineProfileModels(sequelize),
    ...defineSetupModels(sequelize),
    ...defineRunModels(sequelize),
    ...defineIntegrityModels(sequelize),
  };
}
