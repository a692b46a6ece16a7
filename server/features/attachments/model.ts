// Files on handover items: each row points at bytes in storage (server/lib/storage.ts).
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class HandoverAttachment extends Model<InferAttributes<HandoverAttachment>, InferCreationAttributes<HandoverAttachment>> {
  declare id: CreationOptional<number>;
  declare itemId: number;
  declare fileName: string;
  declare mime: string;
  declare size: number;
  declare storageKey: string;
  declare uploadedBy: number;
  declare uploadedAt: Date;
  declare amendmentId: CreationOptional<number | null>;
}

export function initAttachmentModel(sequelize: Sequelize) {
  const pk = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
  const int = DataTypes.INTEGER.UNSIGNED;
  const at = DataTypes.DATE(3);
  HandoverAttachment.init(
    { id: pk, itemId: int, fileName: DataTypes.STRING(200), mime: DataTypes.STRING(80), size: int, storageKey: DataTypes.STRING(200), uploadedBy: int, uploadedAt: at, amendmentId: int },
    { sequelize, tableName: 'handover_attachments', timestamps: false },
  );
}
