import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { ImportMapping } from '../../../shared/schemas/imports';

/** The column mapping last used for a unit and source, so the next import starts from it. */
export class ImportMappingRow extends Model<InferAttributes<ImportMappingRow>, InferCreationAttributes<ImportMappingRow>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare source: string;
  declare mapping: ImportMapping;
  declare updatedBy: number;
  declare updatedAt: Date;
}

export function initImportModel(sequelize: Sequelize) {
  ImportMappingRow.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      unitId: DataTypes.INTEGER.UNSIGNED,
      source: DataTypes.STRING(80),
      mapping: DataTypes.JSON,
      updatedBy: DataTypes.INTEGER.UNSIGNED,
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'import_mappings', timestamps: false },
  );
}
