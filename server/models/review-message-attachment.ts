import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'

/** One of the application's documents sent with an answer to an owner's question. */
export class ReviewMessageAttachment extends Model<
  InferAttributes<ReviewMessageAttachment>,
  InferCreationAttributes<ReviewMessageAttachment>
> {
  declare id: CreationOptional<number>
  declare reviewMessageId: number
  declare applicationAttachmentId: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    ReviewMessageAttachment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        reviewMessageId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        applicationAttachmentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'review_message_attachments', underscored: true },
    )
  }
}
