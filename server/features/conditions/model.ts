import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A condition with a deadline (e.g. equipment to restore within 72 h). Closed by an entry, never deleted. */
export class Condition extends Model<InferAttributes<Condition>, InferCreationAttributes<Condition>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare title: string;
  declare requiredAction: string;
  declare startedAt: Date;
  declare limitAt: Date;
  declare ownerId: number;
  declare openedBy: number;
  declare openedAt: Date;
  declare closedBy: number | null;
  declare closedAt: Date | null;
  declare closingEntryId: number | null;
  declare version: CreationOptional<number>;
  declare expiryNoticeSentAt: CreationOptional<Date | null>;
}

export function initConditionModel(sequelize: Sequelize) {
  Condition.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      unitId: DataTypes.INTEGER.UNSIGNED,
      title: DataTypes.STRING(200),
      requiredAction: DataTypes.STRING(2000),
      startedAt: DataTypes.DATE(3),
      limitAt: DataTypes.DATE(3),
      ownerId: DataTypes.INTEGER.UNSIGNED,
      openedBy: DataTypes.INTEGER.UNSIGNED,
      openedAt: DataTypes.DATE(3),
      closedBy: DataTypes.INTEGER.UNSIGNED,
      closedAt: DataTypes.DATE(3),
      closingEntryId: DataTypes.BIGINT.UNSIGNED,
      version: { type: DataTypes.INTEGER.UNSIGNED, defaultValue: 0 },
      expiryNoticeSentAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'conditions', timestamps: false },
  );
}
