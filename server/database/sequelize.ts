import { Sequelize } from 'sequelize';
import { defineModels, type Models } from './models';

export interface Database {
  sequelize: Sequelize;
  models: Models;
  close(): Promise<void>;
}

/** Opens the connection pool and defines every model once. Never calls `sync()`: see migrate.ts. */
export function openDatabase(url: string): Database {
  const sequelize = new Sequelize(url, { dialect: 'postgres', logging: false, pool: { max: 10 } });
  const models = defineModels(sequelize);
  return { sequelize, models, close: () => sequelize.close() };
}
