import type { LimitSet } from '../../../shared/calc/limits';
import type { PlausibleRanges } from '../../../shared/calc/plausibility';
import type { UnitDesign } from '../../../shared/schemas/plant';
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

const timestamps = { createdAt: DataTypes.DATE(3), updatedAt: DataTypes.DATE(3) };
const pk = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };

export class Station extends Model<InferAttributes<Station>, InferCreationAttributes<Station>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class PlantUnit extends Model<InferAttributes<PlantUnit>, InferCreationAttributes<PlantUnit>> {
  declare id: CreationOptional<number>;
  declare stationId: number;
  declare code: string;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export type EquipmentKind = 'condenser' | 'cw_pump' | 'cooling_tower' | 'air_removal' | 'other';
export class Equipment extends Model<InferAttributes<Equipment>, InferCreationAttributes<Equipment>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare kind: EquipmentKind;
  declare tag: string;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class Crew extends Model<InferAttributes<Crew>, InferCreationAttributes<Crew>> {
  declare id: CreationOptional<number>;
  declare stationId: number;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** One version of a unit's design data (condenser, tower); SI. Never updated: a change is a new version. */
export class UnitDesignVersion extends Model<InferAttributes<UnitDesignVersion>, InferCreationAttributes<UnitDesignVersion>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare effectiveFrom: Date;
  declare data: UnitDesign;
  declare note: string | null;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
}

/** One version of a unit's watch/alarm limits; SI. Never updated: a change is a new version. */
export class LimitSetVersion extends Model<InferAttributes<LimitSetVersion>, InferCreationAttributes<LimitSetVersion>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare effectiveFrom: Date;
  declare limits: LimitSet;
  declare note: string | null;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
}

/** One version of a unit's plausible ranges (SI; flows as fractions of design). Never updated: a change is a new version. */
export class PlausibleRangeVersion extends Model<InferAttributes<PlausibleRangeVersion>, InferCreationAttributes<PlausibleRangeVersion>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare effectiveFrom: Date;
  declare ranges: PlausibleRanges;
  declare note: string | null;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
}

export function initPlantModels(sequelize: Sequelize) {
  Station.init(
    { id: pk, code: DataTypes.STRING(16), name: DataTypes.STRING(120), ...timestamps },
    { sequelize, tableName: 'stations' },
  );
  PlantUnit.init(
    { id: pk, stationId: DataTypes.INTEGER.UNSIGNED, code: DataTypes.STRING(16), name: DataTypes.STRING(120), ...timestamps },
    { sequelize, tableName: 'units', modelName: 'Unit' },
  );
  Equipment.init(
    {
      id: pk,
      unitId: DataTypes.INTEGER.UNSIGNED,
      kind: DataTypes.ENUM('condenser', 'cw_pump', 'cooling_tower', 'air_removal', 'other'),
      tag: DataTypes.STRING(32),
      name: DataTypes.STRING(120),
      ...timestamps,
    },
    { sequelize, tableName: 'equipment', freezeTableName: true },
  );
  Crew.init(
    { id: pk, stationId: DataTypes.INTEGER.UNSIGNED, name: DataTypes.STRING(40), ...timestamps },
    { sequelize, tableName: 'crews' },
  );
  const versionColumns = {
    id: pk,
    unitId: DataTypes.INTEGER.UNSIGNED,
    effectiveFrom: DataTypes.DATE(3),
    note: DataTypes.STRING(500),
    createdBy: DataTypes.INTEGER.UNSIGNED,
    createdAt: DataTypes.DATE(3),
  };
  UnitDesignVersion.init(
    { ...versionColumns, data: DataTypes.JSON },
    { sequelize, tableName: 'unit_design_versions', updatedAt: false },
  );
  LimitSetVersion.init(
    { ...versionColumns, limits: DataTypes.JSON },
    { sequelize, tableName: 'limit_set_versions', updatedAt: false },
  );
  PlausibleRangeVersion.init(
    { ...versionColumns, ranges: DataTypes.JSON },
    { sequelize, tableName: 'plausible_range_versions', updatedAt: false },
  );
}
