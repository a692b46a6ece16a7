import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type FlagSeverity = 'watch' | 'alarm';
export type FlagStatus = 'open' | 'cleared';

/** A reading or check that broke a limit (automatic) or that a shift lead flagged (manual). */
export class Flag extends Model<InferAttributes<Flag>, InferCreationAttributes<Flag>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare parameter: string;
  declare origin: 'automatic' | 'manual';
  declare severity: FlagSeverity;
  declare status: FlagStatus;
  declare firstReadingSetId: number | null;
  declare lastReadingSetId: number | null;
  declare lastValue: number | null;
  declare raisedAt: Date;
  declare lastSeenAt: Date;
  declare raisedBy: number | null;
  declare comment: string | null;
  declare assignedTo: number | null;
  declare followUp: string | null;
  declare clearedBy: number | null;
  declare clearedAt: Date | null;
  declare clearComment: string | null;
  declare version: CreationOptional<number>;
}

/** The follow-up and clearing fields of a flag just raised. */
export const notYetFollowedUp = { assignedTo: null, followUp: null, clearedBy: null, clearedAt: null, clearComment: null } as const;

export function initFlagModel(sequelize: Sequelize) {
  Flag.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      unitId: DataTypes.INTEGER.UNSIGNED,
      parameter: DataTypes.STRING(40),
      origin: DataTypes.ENUM('automatic', 'manual'),
      severity: DataTypes.ENUM('watch', 'alarm'),
      status: DataTypes.ENUM('open', 'cleared'),
      firstReadingSetId: DataTypes.BIGINT.UNSIGNED,
      lastReadingSetId: DataTypes.BIGINT.UNSIGNED,
      lastValue: DataTypes.DOUBLE,
      raisedAt: DataTypes.DATE(3),
      lastSeenAt: DataTypes.DATE(3),
      raisedBy: DataTypes.INTEGER.UNSIGNED,
      comment: DataTypes.STRING(2000),
      assignedTo: DataTypes.INTEGER.UNSIGNED,
      followUp: DataTypes.STRING(2000),
      clearedBy: DataTypes.INTEGER.UNSIGNED,
      clearedAt: DataTypes.DATE(3),
      clearComment: DataTypes.STRING(2000),
      version: { type: DataTypes.INTEGER.UNSIGNED, defaultValue: 0 },
    },
    { sequelize, tableName: 'flags', timestamps: false },
  );
}
