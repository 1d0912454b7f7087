import { createAuditTrail, type AuditTrail } from './audit/audit-trail';
import { createBookingsService, type BookingsService } from './bookings/bookings.service';
import type { Config } from './config/config';
import type { Database } from './database/sequelize';
import { resolveSigningKey } from './integrity/signing-key';
import { createReverificationsService, type ReverificationsService } from './integrity/reverifications.service';
import { createSigningKeysService, type SigningKeysService } from './integrity/signing-keys.service';
import { createVerificationService, type VerificationService } from './integrity/verification.service';
import { createLedgerService, type LedgerService } from './ledger/ledger.service';
import { createProfilesService, type ProfilesService } from './profiles/profiles.service';
import type { AnalysisQueue } from './queue/analysis-queue';
import { createRunsService, type RunsService } from './runs/runs.service';
import { createSetupsService, type SetupsService } from './setups/setups.service';
import { createLogStore } from './storage/create-log-store';
import type { LogStore } from './storage/log-store';
import { createUploadTokensService, type UploadTokensService } from './upload-tokens/upload-tokens.service';
import { createPasswordsService, type PasswordsService } from './users/passwords.service';
import { createUsersService, type UsersService } from './users/users.service';
import { createWorkersService, type WorkersService } from './workers/workers.service';

export interface Services {
  audit: AuditTrail;
  logStore: LogStore;
  users: UsersService;
  passwords: PasswordsService;
  profiles: ProfilesService;
  setups: SetupsService;
  bookings: BookingsService;
  uploadTokens: UploadTokensService;
  runs: RunsService;
  signingKeys: SigningKeysService;
  verification: VerificationService;
  reverifications: ReverificationsService;
  workers: WorkersService;
  ledger: LedgerService;
}

/** Every service of the app over one database and queue: the API and the worker share them. */
export function createServices(config: Config, database: Database, queue: AnalysisQueue): Services {
  const { sequelize, models } = database;
  const audit = createAuditTrail(models.AuditEvent);
  const logStore = createLogStore(config);
  const users = createUsersService(models.User, config.bcryptRounds, audit);
  const passwords = createPasswordsService(sequelize, models, config.bcryptRounds, audit);
  const profiles = createProfilesService(sequelize, models, audit);
  const setups = createSetupsService(sequelize, models, audit);
  const bookings = createBookingsService({ models, profiles, setups, audit });
  const uploadTokens = createUploadTokensService(models, setups, audit);
  const runs = createRunsService({ sequelize, models, logStore, queue, profiles, setups, bookings, audit });
  const signingKeys = createSigningKeysService(sequelize, models, audit, resolveSigningKey(config.signingKey, config.dataDir));
  const verification = createVerificationService(models, logStore, signingKeys);
  const reverifications = createReverificationsService({ sequelize, models, queue, audit });
  const workers = createWorkersService(models);
  const ledger = createLedgerService(sequelize);
  return { audit, logStore, users, passwords, profiles, setups, bookings, uploadTokens, runs, signingKeys, verification, reverifications, workers, ledger };
}
