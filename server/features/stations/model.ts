import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { StationSettings } from '../../../shared/schemas/log';

export class StationSettingsRow extends Model<InferAttributes<StationSettingsRow>, InferCreationAttributes<StationSettingsRow>> {
  declare stationId: number;
  declare timeZone: string;
  declare lateEntryMinutes: number;
  declare shiftChangeTimes: string[];
  declare roundIntervalMinutes: number;
  declare handoverWindowBeforeMinutes: number;
  declare handoverWindowAfterMinutes: number;
  declare positions: StationSettings['positions'];
  declare categories: StationSettings['categories'];
  declare templates: StationSettings['templates'];
  declare crewRotation: CreationOptional<{ anchorShiftStart: string; crewIds: number[] } | null>;
  declare updatedAt: Date;
}

export function initStationModels(sequelize: Sequelize) {
  StationSettingsRow.init(
    {
      stationId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      timeZone: DataTypes.STRING(64),
      lateEntryMinutes: DataTypes.INTEGER.UNSIGNED,
      shiftChangeTimes: DataTypes.JSON,
      roundIntervalMinutes: DataTypes.INTEGER.UNSIGNED,
      handoverWindowBeforeMinutes: DataTypes.INTEGER.UNSIGNED,
      handoverWindowAfterMinutes: DataTypes.INTEGER.UNSIGNED,
      positions: DataTypes.JSON,
      categories: DataTypes.JSON,
      templates: DataTypes.JSON,
      crewRotation: DataTypes.JSON,
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'station_settings', timestamps: false },
  );
}
