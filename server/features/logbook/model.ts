import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A trainer's comment on a past logbook record (through its search document). Only inserted. */
export class ReviewComment extends Model<InferAttributes<ReviewComment>, InferCreationAttributes<ReviewComment>> {
  declare id: CreationOptional<number>;
  declare documentId: number;
  declare authorId: number;
  declare body: string;
  declare createdAt: Date;
}

export function initLogbookModels(sequelize: Sequelize) {
  ReviewComment.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      documentId: DataTypes.BIGINT.UNSIGNED,
      authorId: DataTypes.INTEGER.UNSIGNED,
      body: DataTypes.STRING(4000),
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'review_comments', timestamps: false },
  );
}
