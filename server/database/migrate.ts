import path from 'node:path';
import type { QueryInterface, Sequelize, Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { PROJECT_ROOT } from '../config/config';
import type { SigningKey } from '../integrity/signing-key';
import type { LogStore } from '../storage/log-store';

/** What each migration and seeder receives: pass `transaction` to every query it makes. */
export interface MigrationContext {
  queryInterface: QueryInterface;
  transaction: Transaction;
}

/** What the demo history seeders receive besides: the log store they fill, and the key results are signed with. */
export interface SeederContext extends MigrationContext {
  logStore?: LogStore;
  signingKey?: SigningKey;
  /** Hears of a long seeder's steps (the demo history's nights). */
  progress?: (done: number, total: number) => void;
}

type SeederExtras = Pick<SeederContext, 'logStore' | 'signingKey' | 'progress'>;

interface MigrationModule {
  up(context: SeederContext): Promise<void>;
  down?(context: SeederContext): Promise<void>;
}

/**
 * Schema changes happen only here: the migrations in migrations/, applied in file-name order, each
 * in its own transaction (PostgreSQL DDL is transactional, so a failed one leaves nothing behind),
 * recorded in `SequelizeMeta`, the table name sequelize-cli uses too.
 */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  return applyFolder(sequelize, 'migrations', 'SequelizeMeta');
}

/** Demo people, profiles and setups: the seeders in seeders/, each applied once, recorded in `SequelizeData`. */
export async function seedDemo(sequelize: Sequelize): Promise<string[]> {
  return applyFolder(sequelize, 'seeders', 'SequelizeData');
}

/**
 * The demo lab's history of analysed nightly runs (seeders/history/), archived in `logStore` and
 * signed with `signingKey`;
 * `npm start` loads it, tests leave it out (it takes a few seconds).
 */
export async function seedDemoHistory(sequelize: Sequelize, extras: Required<Pick<SeederExtras, 'logStore' | 'signingKey'>> & Pick<SeederExtras, 'progress'>): Promise<string[]> {
  return applyFolder(sequelize, 'seeders/history', 'SequelizeDataHistory', extras);
}

/**
 * Compiled (this file bundled into dist/server/), the folders' compiled copies beside it are
 * applied; each keeps the name of its TypeScript file, so a database migrated either way is
 * recorded the same.
 */
const COMPILED = __filename.endsWith('.js');

async function applyFolder(sequelize: Sequelize, folder: string, storageTable: string, extras: SeederExtras = {}): Promise<string[]> {
  const umzug = new Umzug({
    migrations: {
      glob: COMPILED ? [`${folder}/*.js`, { cwd: __dirname }] : [`${folder}/*.ts`, { cwd: PROJECT_ROOT }],
      resolve: ({ name: fileName, path: file }) => {
        const name = fileName.replace(/\.js$/, '.ts');
        // Loaded by path at run time (TypeScript through tsx, or the compiled .js): no static import can name it.
        // eslint-disable-next-line @typescript-eslint/no-require-imports
        const migration = require(file!) as MigrationModule;
        const inTransaction = (step: (context: SeederContext) => Promise<void>) => () =>
          sequelize.transaction((transaction) => step({ queryInterface: sequelize.getQueryInterface(), transaction, ...extras }));
        return {
          name,
          up: inTransaction((context) => migration.up(context)),
          down: migration.down ? inTransaction((context) => migration.down!(context)) : undefined,
        };
      },
    },
    storage: new SequelizeStorage({ sequelize, modelName: storageTable }),
    logger: undefined,
  });
  const applied = await umzug.up();
  return applied.map((migration) => path.basename(migration.name));
}
