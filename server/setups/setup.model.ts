import type { ColumnMapping } from '@shared/analysis';
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type ModelStatic, type Sequelize } from 'sequelize';

export class SetupRecord extends Model<InferAttributes<SetupRecord>, InferCreationAttributes<SetupRecord>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare description: CreationOptional<string>;
  declare stationALabel: string;
  declare stationBLabel: string;
  declare defaultProfileId: number;
  declare extraRecipients: CreationOptional<string[]>;
  declare fourEyes: CreationOptional<boolean>;
  /** The saved column mapping of the setup's logs, or null: guessed from each header. */
  declare columnMapping: CreationOptional<ColumnMapping | null>;
  /** Straight-line distance between the stations, metres; null: unknown. */
  declare stationDistanceM: CreationOptional<number | null>;
  /** Station B's clock minus station A's at the same instant, ns, and its uncertainty; both null: unknown. */
  declare clockOffsetNs: CreationOptional<number | null>;
  declare clockUncertaintyNs: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class SetupShiftLeadRecord extends Model<InferAttributes<SetupShiftLeadRecord>, InferCreationAttributes<SetupShiftLeadRecord>> {
  declare setupId: number;
  declare userId: number;
}

export interface SetupModels {
  Setup: ModelStatic<SetupRecord>;
  SetupShiftLead: ModelStatic<SetupShiftLeadRecord>;
}

/** `setups` and the shift leads assigned to each. */
export function defineSetupModels(sequelize: Sequelize): SetupModels {
  class Setup extends SetupRecord {}
  Setup.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      stationALabel: { type: DataTypes.STRING(120), allowNull: false, field: 'station_a_label' },
      stationBLabel: { type: DataTypes.STRING(120), allowNull: false, field: 'station_b_label' },
      defaultProfileId: { type: DataTypes.INTEGER, allowNull: false, field: 'default_profile_id' },
      extraRecipients: { type: DataTypes.ARRAY(DataTypes.STRING(320)), allowNull: false, defaultValue: [], field: 'extra_recipients' },
      fourEyes: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true, field: 'four_eyes' },
      columnMapping: { type: DataTypes.JSONB, field: 'column_mapping' },
      stationDistanceM: { type: DataTypes.DOUBLE, field: 'station_distance_m' },
      clockOffsetNs: { type: DataTypes.DOUBLE, field: 'clock_offset_ns' },
      clockUncertaintyNs: { type: DataTypes.DOUBLE, field: 'clock_uncertainty_ns' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'setups', modelName: 'Setup' },
  );
  class SetupShiftLead extends SetupShiftLeadRecord {}
  SetupShiftLead.init(
    {
      setupId: { type: DataTypes.INTEGER, primaryKey: true, field: 'setup_id' },
      userId: { type: DataTypes.INTEGER, primaryKey: true, field: 'user_id' },
    },
    { sequelize, tableName: 'setup_shift_leads', modelName: 'SetupShiftLead', timestamps: false },
  );
  return { Setup, SetupShiftLead };
}
