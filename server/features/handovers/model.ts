import type { CondenserSnapshot } from '../../../shared/shift-condenser';
import type { handoverItemKinds } from '../../../shared/schemas/handovers';
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type HandoverStatus = 'draft' | 'submitted' | 'accepted';
export type ItemKind = (typeof handoverItemKinds)[number];

export class Handover extends Model<InferAttributes<Handover>, InferCreationAttributes<Handover>> {
  declare id: CreationOptional<number>;
  declare unitId: number;
  declare shiftStart: Date;
  declare handoverAt: Date;
  declare outgoingCrewId: number | null;
  declare incomingCrewId: number | null;
  declare notesHtml: string;
  declare notesVersion: CreationOptional<number>;
  declare status: HandoverStatus;
  declare createdBy: number;
  declare createdAt: Date;
  declare submittedBy: number | null;
  declare submittedAt: Date | null;
  declare acceptedBy: number | null;
  declare acceptedAt: Date | null;
  declare reminderSentAt: CreationOptional<Date | null>;
  /** Written once at submit (migration 0011). */
  declare condenserSnapshot: CreationOptional<CondenserSnapshot | null>;
}

export class HandoverItem extends Model<InferAttributes<HandoverItem>, InferCreationAttributes<HandoverItem>> {
  declare id: CreationOptional<number>;
  declare handoverId: number;
  declare kind: ItemKind;
  declare title: string;
  declare detail: string | null;
  declare reference: string | null;
  declare priority: 'low' | 'normal' | 'high';
  declare sourceId: number | null;
  /** Null for items the handover attached by itself (open flags, conditions…). */
  declare createdBy: number | null;
  declare createdAt: Date;
  declare clientKey: CreationOptional<string | null>;
  /** Moves on with each edit of a draft item and each amendment after submit. */
  declare version: CreationOptional<number>;
  declare amendedAt: CreationOptional<Date | null>;
  declare removedAt: CreationOptional<Date | null>;
  declare removedBy: CreationOptional<number | null>;
}

export class HandoverAck extends Model<InferAttributes<HandoverAck>, InferCreationAttributes<HandoverAck>> {
  declare itemId: number;
  declare userId: number;
  /** The item's version this acknowledgement was given to. */
  declare itemVersion: number;
  declare acknowledgedAt: Date;
}

export class HandoverQuery extends Model<InferAttributes<HandoverQuery>, InferCreationAttributes<HandoverQuery>> {
  declare id: CreationOptional<number>;
  declare itemId: number;
  declare askedBy: number;
  declare askedAt: Date;
  declare question: string;
  declare answeredBy: number | null;
  declare answeredAt: Date | null;
  declare answer: string | null;
  declare clientKey: CreationOptional<string | null>;
}

export class HandoverAmendment extends Model<InferAttributes<HandoverAmendment>, InferCreationAttributes<HandoverAmendment>> {
  declare id: CreationOptional<number>;
  declare handoverId: number;
  declare itemId: number | null;
  declare authorId: number;
  declare amendedAt: Date;
  declare reason: string;
  declare text: string;
  declare clientKey: CreationOptional<string | null>;
}

export function initHandoverModels(sequelize: Sequelize) {
  const pk = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
  const int = DataTypes.INTEGER.UNSIGNED;
  const at = DataTypes.DATE(3);
  Handover.init(
    {
      id: pk, unitId: int, shiftStart: at, handoverAt: at, outgoingCrewId: int, incomingCrewId: int,
      notesHtml: DataTypes.TEXT('medium'), notesVersion: { type: int, defaultValue: 0 },
      status: DataTypes.ENUM('draft', 'submitted', 'accepted'), createdBy: int, createdAt: at,
      submittedBy: int, submittedAt: at, acceptedBy: int, acceptedAt: at, reminderSentAt: at,
      condenserSnapshot: DataTypes.JSON,
    },
    { sequelize, tableName: 'handovers', timestamps: false },
  );
  HandoverItem.init(
    {
      id: pk, handoverId: int, kind: DataTypes.STRING(30), title: DataTypes.STRING(300), detail: DataTypes.TEXT,
      reference: DataTypes.STRING(80), priority: DataTypes.ENUM('low', 'normal', 'high'), sourceId: DataTypes.BIGINT.UNSIGNED,
      createdBy: int, createdAt: at, clientKey: DataTypes.STRING(64), version: { type: int, defaultValue: 1 },
      amendedAt: at, removedAt: at, removedBy: int,
    },
    { sequelize, tableName: 'handover_items', timestamps: false },
  );
  HandoverAck.init(
    { itemId: { type: int, primaryKey: true }, userId: { type: int, primaryKey: true }, itemVersion: { type: int, primaryKey: true }, acknowledgedAt: at },
    { sequelize, tableName: 'handover_acks', timestamps: false },
  );
  HandoverQuery.init(
    { id: pk, itemId: int, askedBy: int, askedAt: at, question: DataTypes.STRING(2000), answeredBy: int, answeredAt: at, answer: DataTypes.STRING(2000), clientKey: DataTypes.STRING(64) },
    { sequelize, tableName: 'handover_queries', timestamps: false },
  );
  HandoverAmendment.init(
    { id: pk, handoverId: int, itemId: int, authorId: int, amendedAt: at, reason: DataTypes.STRING(1000), text: DataTypes.TEXT, clientKey: DataTypes.STRING(64) },
    { sequelize, tableName: 'handover_amendments', timestamps: false },
  );
}
