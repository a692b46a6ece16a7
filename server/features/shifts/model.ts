import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A one-off change of which crew works a shift. */
export class CrewSwap extends Model<InferAttributes<CrewSwap>, InferCreationAttributes<CrewSwap>> {
  declare id: CreationOptional<number>;
  declare stationId: number;
  declare shiftStart: Date;
  declare crewId: number;
  declare reason: string;
  declare createdBy: number;
  declare createdAt: Date;
}

export function initShiftModels(sequelize: Sequelize) {
  CrewSwap.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      stationId: DataTypes.INTEGER.UNSIGNED,
      shiftStart: DataTypes.DATE(3),
      crewId: DataTypes.INTEGER.UNSIGNED,
      reason: DataTypes.STRING(500),
      createdBy: DataTypes.INTEGER.UNSIGNED,
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'crew_swaps', timestamps: false },
  );
}
