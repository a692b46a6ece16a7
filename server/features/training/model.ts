import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { TrainingLevel } from '../../../shared/schemas/training';

/** One version of a qualification task; an edit inserts the next version of the same key. */
export class QualificationTask extends Model<InferAttributes<QualificationTask>, InferCreationAttributes<QualificationTask>> {
  declare id: CreationOptional<number>;
  declare taskKey: string;
  declare version: number;
  declare position: string;
  declare system: string;
  declare title: string;
  declare standard: string;
  declare procedureRef: string | null;
  declare requiredPerformances: number;
  declare retired: boolean;
  declare changeNote: string | null;
  declare createdBy: number;
  declare createdAt: Date;
}

/** A trainee's practice of a task, countersigned (or rejected) by the supervising operator. */
export class TrainingEntry extends Model<InferAttributes<TrainingEntry>, InferCreationAttributes<TrainingEntry>> {
  declare id: CreationOptional<number>;
  declare traineeId: number;
  declare taskId: number;
  declare performedOn: string;
  declare level: TrainingLevel;
  declare unitId: number | null;
  declare shiftStart: Date | null;
  declare readingSetId: number | null;
  declare handoverItemId: number | null;
  declare note: string;
  declare supervisorId: number | null;
  declare status: 'awaiting_countersign' | 'countersigned' | 'rejected';
  declare countersignedBy: number | null;
  declare countersignedAt: Date | null;
  declare rejectReason: string | null;
  declare recordedAt: Date;
}

/** A trainer's sign-off or return of a task for a trainee. Never changed once written. */
export class TrainingDecision extends Model<InferAttributes<TrainingDecision>, InferCreationAttributes<TrainingDecision>> {
  declare id: CreationOptional<number>;
  declare traineeId: number;
  declare taskId: number;
  declare taskKey: string;
  declare decision: 'signed_off' | 'returned';
  declare comments: string;
  declare trainerId: number;
  declare decidedAt: Date;
}

export class TrainingAmendment extends Model<InferAttributes<TrainingAmendment>, InferCreationAttributes<TrainingAmendment>> {
  declare id: CreationOptional<number>;
  declare target: 'entry' | 'decision';
  declare targetId: number;
  declare authorId: number;
  declare amendedAt: Date;
  declare reason: string;
  declare text: string;
}

export function initTrainingModels(sequelize: Sequelize) {
  const pk = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
  const options = (tableName: string) => ({ sequelize, tableName, timestamps: false });
  QualificationTask.init(
    {
      id: pk,
      taskKey: DataTypes.STRING(24),
      version: DataTypes.INTEGER.UNSIGNED,
      position: DataTypes.STRING(40),
      system: DataTypes.STRING(40),
      title: DataTypes.STRING(200),
      standard: DataTypes.STRING(2000),
      procedureRef: DataTypes.STRING(80),
      requiredPerformances: DataTypes.INTEGER.UNSIGNED,
      retired: DataTypes.BOOLEAN,
      changeNote: DataTypes.STRING(500),
      createdBy: DataTypes.INTEGER.UNSIGNED,
      createdAt: DataTypes.DATE(3),
    },
    options('qualification_tasks'),
  );
  TrainingEntry.init(
    {
      id: pk,
      traineeId: DataTypes.INTEGER.UNSIGNED,
      taskId: DataTypes.INTEGER.UNSIGNED,
      performedOn: DataTypes.DATEONLY,
      level: DataTypes.ENUM('observed', 'supervised', 'alone'),
      unitId: DataTypes.INTEGER.UNSIGNED,
      shiftStart: DataTypes.DATE(3),
      readingSetId: DataTypes.BIGINT.UNSIGNED,
      handoverItemId: DataTypes.INTEGER.UNSIGNED,
      note: DataTypes.STRING(2000),
      supervisorId: DataTypes.INTEGER.UNSIGNED,
      status: DataTypes.ENUM('awaiting_countersign', 'countersigned', 'rejected'),
      countersignedBy: DataTypes.INTEGER.UNSIGNED,
      countersignedAt: DataTypes.DATE(3),
      rejectReason: DataTypes.STRING(1000),
      recordedAt: DataTypes.DATE(3),
    },
    options('training_entries'),
  );
  TrainingDecision.init(
    {
      id: pk,
      traineeId: DataTypes.INTEGER.UNSIGNED,
      taskId: DataTypes.INTEGER.UNSIGNED,
      taskKey: DataTypes.STRING(24),
      decision: DataTypes.ENUM('signed_off', 'returned'),
      comments: DataTypes.STRING(2000),
      trainerId: DataTypes.INTEGER.UNSIGNED,
      decidedAt: DataTypes.DATE(3),
    },
    options('training_decisions'),
  );
  TrainingAmendment.init(
    {
      id: pk,
      target: DataTypes.ENUM('entry', 'decision'),
      targetId: DataTypes.INTEGER.UNSIGNED,
      authorId: DataTypes.INTEGER.UNSIGNED,
      amendedAt: DataTypes.DATE(3),
      reason: DataTypes.STRING(1000),
      text: DataTypes.STRING(2000),
    },
    options('training_amendments'),
  );
}
