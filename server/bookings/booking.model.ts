import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type ModelStatic, type Sequelize } from 'sequelize';

export class BookingRecord extends Model<InferAttributes<BookingRecord>, InferCreationAttributes<BookingRecord>> {
  declare id: CreationOptional<number>;
  declare setupId: number;
  declare night: string;
  declare windowStart: Date;
  declare windowEnd: Date;
  declare plannedRounds: number;
  declare profileVersionId: number;
  declare profileReason: CreationOptional<string>;
  /** Drawn at booking; revealed once the booking's first log is in. */
  declare seed: string;
  declare seedCommitment: string;
  declare bookedBy: number;
  declare createdAt: CreationOptional<Date>;
}

/** `bookings`: nights booked before acquisition (see the migration that creates them). */
export function defineBookingModel(sequelize: Sequelize): ModelStatic<BookingRecord> {
  class Booking extends BookingRecord {}
  Booking.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      setupId: { type: DataTypes.INTEGER, allowNull: false, field: 'setup_id' },
      night: { type: DataTypes.DATEONLY, allowNull: false },
      windowStart: { type: DataTypes.DATE, allowNull: false, field: 'window_start' },
      windowEnd: { type: DataTypes.DATE, allowNull: false, field: 'window_end' },
      plannedRounds: {
        type: DataTypes.BIGINT,
        allowNull: false,
        field: 'planned_rounds',
        get() {
          return Number(this.getDataValue('plannedRounds'));
        },
      },
      profileVersionId: { type: DataTypes.INTEGER, allowNull: false, field: 'profile_version_id' },
      profileReason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '', field: 'profile_reason' },
      seed: { type: DataTypes.CHAR(64), allowNull: false },
      seedCommitment: { type: DataTypes.CHAR(64), allowNull: false, field: 'seed_commitment' },
      bookedBy: { type: DataTypes.INTEGER, allowNull: false, field: 'booked_by' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'bookings', modelName: 'Booking', updatedAt: false },
  );
  return Booking;
}
