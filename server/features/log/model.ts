import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One narrative log entry. Append-only: never updated or deleted. */
export class LogEntry extends Model<InferAttributes<LogEntry>, InferCreationAttributes<LogEntry>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare position: string;
  declare category: string;
  declare eventAt: Date;
  /** When it was written: the server's clock, or the device's for a record kept offline. */
  declare enteredAt: Date;
  /** When the server had it (the same as entered for an entry written online). */
  declare receivedAt: Date;
  declare shiftStart: Date;
  declare late: boolean;
  /** Arrived more than the station's late-entry minutes after it was entered (kept on a device). */
  declare arrivedLate: CreationOptional<boolean>;
  /** The device's id for it: a retry finds the stored entry instead of making a second. */
  declare clientId: string | null;
  declare authorId: number;
  /** Written by a trainee (their role when writing it). */
  declare writtenAsTrainee: CreationOptional<boolean>;
  declare text: string;
  declare equipmentId: number | null;
  declare readingSetId: number | null;
  declare flagId: number | null;
  declare conditionId: number | null;
  declare carryToHandover: boolean;
}

export class LogAmendment extends Model<InferAttributes<LogAmendment>, InferCreationAttributes<LogAmendment>> {
  declare id: CreationOptional<number>;
  declare entryId: number;
  declare authorId: number;
  declare amendedAt: Date;
  declare reason: string;
  declare text: string;
}

export class LogReview extends Model<InferAttributes<LogReview>, InferCreationAttributes<LogReview>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare position: string;
  declare shiftStart: Date;
  declare reviewedBy: number;
  declare reviewedAt: Date;
}

export function initLogModels(sequelize: Sequelize) {
  const bigPk = { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true };
  LogEntry.init(
    {
      id: bigPk,
      unitId: DataTypes.INTEGER.UNSIGNED,
      position: DataTypes.STRING(40),
      category: DataTypes.STRING(40),
      eventAt: DataTypes.DATE(3),
      enteredAt: DataTypes.DATE(3),
      receivedAt: DataTypes.DATE(3),
      shiftStart: DataTypes.DATE(3),
      late: DataTypes.BOOLEAN,
      arrivedLate: { type: DataTypes.BOOLEAN, defaultValue: false },
      clientId: DataTypes.CHAR(36),
      authorId: DataTypes.INTEGER.UNSIGNED,
      writtenAsTrainee: { type: DataTypes.BOOLEAN, defaultValue: false },
      text: DataTypes.TEXT,
      equipmentId: DataTypes.INTEGER.UNSIGNED,
      readingSetId: DataTypes.BIGINT.UNSIGNED,
      flagId: DataTypes.INTEGER.UNSIGNED,
      conditionId: DataTypes.INTEGER.UNSIGNED,
      carryToHandover: DataTypes.BOOLEAN,
    },
    { sequelize, tableName: 'log_entries', timestamps: false },
  );
  LogAmendment.init(
    {
      id: bigPk,
      entryId: DataTypes.BIGINT.UNSIGNED,
      authorId: DataTypes.INTEGER.UNSIGNED,
      amendedAt: DataTypes.DATE(3),
      reason: DataTypes.STRING(1000),
      text: DataTypes.TEXT,
    },
    { sequelize, tableName: 'log_amendments', timestamps: false },
  );
  LogReview.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      unitId: DataTypes.INTEGER.UNSIGNED,
      position: DataTypes.STRING(40),
      shiftStart: DataTypes.DATE(3),
      reviewedBy: DataTypes.INTEGER.UNSIGNED,
      reviewedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'log_reviews', timestamps: false },
  );
}
