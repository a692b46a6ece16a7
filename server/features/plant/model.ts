import type { TubeMaterial } from '../../../shared/calc/hei';
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

export class CondenserDesign extends Model<InferAttributes<CondenserDesign>, InferCreationAttributes<CondenserDesign>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare surfaceAreaM2: number;
  declare tubeOdMm: number;
  declare tubeGaugeBwg: number;
  declare tubeMaterial: TubeMaterial;
  declare tubeCount: number;
  declare passes: number;
  declare designCwFlowKgS: number;
  declare designCwInletK: number;
  declare designBackpressurePa: number;
  declare designDutyW: number;
  declare designCleanliness: number;
  declare designCleanUWM2K: number | null;
  declare backpressureCorrection: [number, number][];
  declare energyPricePerMwh: number | null;
  declare currency: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
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
  CondenserDesign.init(
    {
      id: pk,
      unitId: DataTypes.INTEGER.UNSIGNED,
      surfaceAreaM2: { type: DataTypes.DOUBLE, field: 'surface_area_m2' },
      tubeOdMm: DataTypes.DOUBLE,
      tubeGaugeBwg: DataTypes.INTEGER,
      tubeMaterial: DataTypes.STRING(40),
      tubeCount: DataTypes.INTEGER,
      passes: DataTypes.INTEGER,
      designCwFlowKgS: { type: DataTypes.DOUBLE, field: 'design_cw_flow_kg_s' },
      designCwInletK: { type: DataTypes.DOUBLE, field: 'design_cw_inlet_k' },
      designBackpressurePa: { type: DataTypes.DOUBLE, field: 'design_backpressure_pa' },
      designDutyW: { type: DataTypes.DOUBLE, field: 'design_duty_w' },
      designCleanliness: DataTypes.DOUBLE,
      designCleanUWM2K: { type: DataTypes.DOUBLE, field: 'design_clean_u_w_m2k' },
      backpressureCorrection: DataTypes.JSON,
      energyPricePerMwh: DataTypes.DOUBLE,
      currency: DataTypes.STRING(8),
      ...timestamps,
    },
    { sequelize, tableName: 'condenser_designs' },
  );
}
