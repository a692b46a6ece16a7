import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class StandingOrder extends Model<InferAttributes<StandingOrder>, InferCreationAttributes<StandingOrder>> {
  declare id: CreationOptional<number>;
  declare stationId: number;
  declare title: string;
  declare bodyHtml: string;
  declare bodyText: string;
  declare effectiveFrom: Date;
  declare effectiveTo: Date | null;
  declare crewIds: number[];
  declare positions: string[];
  declare issuedBy: number;
  declare issuedAt: Date;
}

export class StandingOrderAck extends Model<InferAttributes<StandingOrderAck>, InferCreationAttributes<StandingOrderAck>> {
  declare orderId: number;
  declare userId: number;
  declare acknowledgedAt: Date;
}

export function initStandingOrderModels(sequelize: Sequelize) {
  StandingOrder.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      stationId: DataTypes.INTEGER.UNSIGNED,
      title: DataTypes.STRING(200),
      bodyHtml: DataTypes.TEXT,
      bodyText: DataTypes.TEXT,
      effectiveFrom: DataTypes.DATE(3),
      effectiveTo: DataTypes.DATE(3),
      crewIds: DataTypes.JSON,
      positions: DataTypes.JSON,
      issuedBy: DataTypes.INTEGER.UNSIGNED,
      issuedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'standing_orders', timestamps: false },
  );
  StandingOrderAck.init(
    {
      orderId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      acknowledgedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'standing_order_acks', timestamps: false },
  );
}
