import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Evaluation, ReadingSetSi } from '../../../shared/calc/evaluate';
import type { Status } from '../../../shared/calc/limits';
import type { PlausibleKey } from '../../../shared/calc/plausibility';
import type { ReadingSetInput } from '../../../shared/schemas/reading-set';

export type ReadingSource = 'round' | 'import';

/** One reading set as first recorded. Append-only: never updated or deleted. */
export class ReadingSet extends Model<InferAttributes<ReadingSet>, InferCreationAttributes<ReadingSet>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare takenAt: Date;
  /** When it arrived (the server's clock). */
  declare recordedAt: Date;
  /** When it was entered: the arrival for a round sent at once, the device's clock for one kept offline. */
  declare enteredAt: Date;
  /** Arrived more than the station's late-entry minutes after it was entered. */
  declare arrivedLate: CreationOptional<boolean>;
  /** The device's id for it: a retry finds the stored round instead of making a second. */
  declare clientId: CreationOptional<string | null>;
  declare recordedBy: number;
  declare recordedAsTrainee: boolean;
  declare source: ReadingSource;
  declare importKey: string | null;
  declare designVersionId: number;
  declare limitVersionId: number;
  /** Null: judged by the starting plausible ranges (the unit had none of its own then). */
  declare plausibleVersionId: number | null;
  declare raw: ReadingSetInput;
  declare si: ReadingSetSi;
  declare results: Evaluation;
  declare worstStatus: Status;
  /** Readings and checks the recorder confirmed outside the plausible range; [] when none. */
  declare outsidePlausible: CreationOptional<PlausibleKey[]>;
}

/** A correction: the new values with who, when and why. The original stays as it was. */
export class ReadingAmendment extends Model<InferAttributes<ReadingAmendment>, InferCreationAttributes<ReadingAmendment>> {
  declare id: CreationOptional<number>;
  declare readingSetId: number;
  declare amendedBy: number;
  declare amendedAt: Date;
  declare reason: string;
  declare raw: ReadingSetInput;
  declare si: ReadingSetSi;
  declare results: Evaluation;
  declare worstStatus: Status;
  declare outsidePlausible: CreationOptional<PlausibleKey[]>;
}

export class ReadingCountersign extends Model<InferAttributes<ReadingCountersign>, InferCreationAttributes<ReadingCountersign>> {
  declare readingSetId: number;
  declare signedBy: number;
  declare signedAt: Date;
}

/** Derived: the current value of each computed check, one row each, for trends. */
export class ReadingValue extends Model<InferAttributes<ReadingValue>, InferCreationAttributes<ReadingValue>> {
  declare readingSetId: number;
  declare parameter: string;
  declare unitId: number;
  declare takenAt: Date;
  declare value: number;
  declare status: Status;
  /** This check's value lies outside the plausible range: trends leave it out of the axis. */
  declare outsidePlausible: CreationOptional<boolean>;
}

const statusType = DataTypes.ENUM('normal', 'watch', 'alarm', 'unknown');
const bigId = { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true };
// BIGINT ids come back from the mariadb driver as numbers up to 2^53, which is plenty here.

export function initReadingModels(sequelize: Sequelize) {
  ReadingSet.init(
    {
      id: bigId,
      unitId: DataTypes.INTEGER.UNSIGNED,
      takenAt: DataTypes.DATE(3),
      recordedAt: DataTypes.DATE(3),
      enteredAt: DataTypes.DATE(3),
      arrivedLate: { type: DataTypes.BOOLEAN, defaultValue: false },
      clientId: { type: DataTypes.CHAR(36), defaultValue: null },
      recordedBy: DataTypes.INTEGER.UNSIGNED,
      recordedAsTrainee: DataTypes.BOOLEAN,
      source: DataTypes.ENUM('round', 'import'),
      importKey: DataTypes.STRING(64),
      designVersionId: DataTypes.INTEGER.UNSIGNED,
      limitVersionId: DataTypes.INTEGER.UNSIGNED,
      plausibleVersionId: DataTypes.INTEGER.UNSIGNED,
      raw: DataTypes.JSON,
      si: DataTypes.JSON,
      results: DataTypes.JSON,
      worstStatus: statusType,
      outsidePlausible: { type: DataTypes.JSON, defaultValue: [] },
    },
    { sequelize, tableName: 'reading_sets', timestamps: false },
  );
  ReadingAmendment.init(
    {
      id: bigId,
      readingSetId: DataTypes.BIGINT.UNSIGNED,
      amendedBy: DataTypes.INTEGER.UNSIGNED,
      amendedAt: DataTypes.DATE(3),
      reason: DataTypes.STRING(1000),
      raw: DataTypes.JSON,
      si: DataTypes.JSON,
      results: DataTypes.JSON,
      worstStatus: statusType,
      outsidePlausible: { type: DataTypes.JSON, defaultValue: [] },
    },
    { sequelize, tableName: 'reading_amendments', timestamps: false },
  );
  ReadingCountersign.init(
    {
      readingSetId: { type: DataTypes.BIGINT.UNSIGNED, primaryKey: true },
      signedBy: DataTypes.INTEGER.UNSIGNED,
      signedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'reading_countersigns', timestamps: false },
  );
  ReadingValue.init(
    {
      readingSetId: { type: DataTypes.BIGINT.UNSIGNED, primaryKey: true },
      parameter: { type: DataTypes.STRING(40), primaryKey: true },
      unitId: DataTypes.INTEGER.UNSIGNED,
      takenAt: DataTypes.DATE(3),
      value: DataTypes.DOUBLE,
      status: statusType,
      outsidePlausible: { type: DataTypes.BOOLEAN, defaultValue: false },
    },
    { sequelize, tableName: 'reading_values', timestamps: false },
  );
}
