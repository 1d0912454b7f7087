import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type ModelStatic, type Sequelize } from 'sequelize';

export class ProfileRecord extends Model<InferAttributes<ProfileRecord>, InferCreationAttributes<ProfileRecord>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare description: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
}

export class ProfileVersionRecord extends Model<InferAttributes<ProfileVersionRecord>, InferCreationAttributes<ProfileVersionRecord>> {
  declare id: CreationOptional<number>;
  declare profileId: number;
  declare version: number;
  declare parameters: Record<string, unknown>;
  declare note: CreationOptional<string>;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
}

export interface ProfileModels {
  Profile: ModelStatic<ProfileRecord>;
  ProfileVersion: ModelStatic<ProfileVersionRecord>;
}

/** `profiles` and their fixed `profile_versions` (see the pipeline migration). */
export function defineProfileModels(sequelize: Sequelize): ProfileModels {
  class Profile extends ProfileRecord {}
  Profile.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'profiles', modelName: 'Profile', updatedAt: false },
  );
  class ProfileVersion extends ProfileVersionRecord {}
  ProfileVersion.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      profileId: { type: DataTypes.INTEGER, allowNull: false, field: 'profile_id' },
      version: { type: DataTypes.INTEGER, allowNull: false },
      parameters: { type: DataTypes.JSONB, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdBy: { type: DataTypes.INTEGER, field: 'created_by' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'profile_versions', modelName: 'ProfileVersion', updatedAt: false },
  );
  Profile.hasMany(ProfileVersion, { as: 'versions', foreignKey: 'profileId' });
  ProfileVersion.belongsTo(Profile, { as: 'profile', foreignKey: 'profileId' });
  return { Profile, ProfileVersion };
}
