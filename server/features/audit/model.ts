import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare actorId: number | null;
  declare action: string;
  declare entity: string;
  declare entityId: string | null;
  declare before: unknown;
  declare after: unknown;
  declare at: Date;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        actorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        action: { type: DataTypes.STRING(64), allowNull: false },
        entity: { type: DataTypes.STRING(64), allowNull: false },
        entityId: { type: DataTypes.STRING(64), allowNull: true },
        before: { type: DataTypes.JSON, allowNull: true },
        after: { type: DataTypes.JSON, allowNull: true },
        at: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'audit_events', timestamps: false },
    );
  }
}
