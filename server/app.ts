import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { auditRoutes } from './audit/audit.routes';
import { authRoutes } from './auth/auth.routes';
import { bookingsRoutes } from './bookings/bookings.routes';
import { createGuards } from './auth/passport';
import { RESUMABLE_UPLOAD_PATH } from '@shared/api';
import type { Config } from './config/config';
import type { Database } from './database/sequelize';
import { apiNotFound, errorHandler } from './http/error-handler';
import type { Lifecycle } from './http/drain';
import { healthRoutes } from './http/health.routes';
import { requestLog } from './http/request-log';
import { refuseNulCharacters } from './http/refuse-nul';
import { runIntegrityRoutes } from './integrity/integrity.routes';
import { signingKeysRoutes } from './integrity/signing-keys.routes';
import type { AppMail } from './mail/app-mail';
import { metricsRoutes } from './metrics/metrics.routes';
import { openApiRoutes } from './openapi/openapi.routes';
import { plannerRoutes } from './planner/planner.routes';
import { profilesRoutes } from './profiles/profiles.routes';
import type { AnalysisQueue } from './queue/analysis-queue';
import { resumableUploads } from './runs/resumable-uploads';
import { runsRoutes } from './runs/runs.routes';
import type { Services } from './services';
import { setupsRoutes } from './setups/setups.routes';
import { uploaderGuard } from './upload-tokens/uploader-guard';
import { uploadTokensRoutes } from './upload-tokens/upload-tokens.routes';
import { ledgerRoutes } from './ledger/ledger.routes';
import { usersRoutes } from './users/users.routes';
import { workersRoutes } from './workers/workers.routes';

export interface AppDependencies {
  config: Config;
  database: Database;
  services: Services;
  jwtSecret: string;
  appMail: AppMail;
  queue: AnalysisQueue;
  /** Whether the API is stopping (readiness says so); tests leave it out. */
  lifecycle?: Lifecycle;
}

/**
 * Builds the Express app: configuration, middleware, one router per resource, the built Angular
 * app, and the one error handler last. It does not listen: start.ts does, tests use supertest.
 */
export function createApp({ config, database, services, jwtSecret, appMail, queue, lifecycle = { draining: false } }: AppDependencies): Express {
  const app = express();
  const guards = createGuards(jwtSecret, services.users);

  app.disable('x-powered-by');
  // One proxy hop (a lab's reverse proxy) may set the client address used by the rate limit.
  app.set('trust proxy', 'loopback');
  app.use(helmet());
  app.use(requestLog());
  app.use('/api', express.json({ limit: '100kb' }));
  app.use('/api', refuseNulCharacters);

  app.use('/api', healthRoutes({ database, queue, logStore: services.logStore, lifecycle }));
  app.use('/api', openApiRoutes());
  app.use('/api/auth', authRoutes(config, jwtSecret, services.users, services.passwords, guards));
  app.use('/api/users', usersRoutes(services.users, services.passwords, guards, appMail));
  app.use('/api/profiles', profilesRoutes(services.profiles, guards));
  const uploader = uploaderGuard(guards, services.uploadTokens);
  app.use('/api/setups/:id/upload-tokens', uploadTokensRoutes({ tokens: services.uploadTokens, guards }));
  app.use('/api/setups', setupsRoutes(services.setups, guards));
  app.use('/api/bookings', bookingsRoutes({ bookings: services.bookings, setups: services.setups, appMail, guards }));
  app.use('/api/planner', plannerRoutes({ models: database.models, setups: services.setups, profiles: services.profiles, guards }));
  app.use('/api/signing-keys', signingKeysRoutes(services.signingKeys));
  app.use('/api/workers', workersRoutes(services.workers, guards));
  app.use('/api', ledgerRoutes(services.ledger, guards));
  app.use('/api/audit', auditRoutes({ models: database.models, audit: services.audit, guards }));
  app.use('/api/runs', runIntegrityRoutes({ ...services, models: database.models, guards }));
  app.use('/api/runs', runsRoutes({ config, runs: services.runs, setups: services.setups, appMail, logStore: services.logStore, models: database.models, guards, uploader }));
  app.use(
    RESUMABLE_UPLOAD_PATH,
    resumableUploads({ sequelize: database.sequelize, runs: services.runs, logStore: services.logStore, uploader, dataDir: config.dataDir, limitBytes: config.uploadLimitBytes }),
  );
  app.use('/api', apiNotFound);
  app.use(metricsRoutes({ sequelize: database.sequelize, guards, scrapeToken: config.metricsToken }));

  serveBuiltApp(app, config.appDir);
  app.use(errorHandler);
  return app;
}

/** The built Angular app, with every other path answered by index.html (client-side routes). */
function serveBuiltApp(app: Express, appDir: string): void {
  const indexFile = path.join(appDir, 'index.html');
  app.use(express.static(appDir, { index: false, maxAge: '1h' }));
  app.get('/{*path}', (_request, response, next) => {
    if (!fs.existsSync(indexFile)) return next();
    response.sendFile(indexFile, { maxAge: 0 });
  });
}
