import type { Sequelize } from 'sequelize';
import { defineUserModel, type UserModelStatic } from '../users/user.model';

export interface Models {
  User: UserModelStatic;
}

/** Every Sequelize model of the app, defined in one place. */
export function defineModels(sequelize: Sequelize): Models {
  return { User: defineUserModel(sequelize) };
}
