import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize'
import type { ApplicationAttachment } from './application-attachment.ts'
import type { User } from './user.ts'

/** A question from the owner's engineer or an answer from the applicant. */
export class ReviewMessage extends Model<
  InferAttributes<ReviewMessage>,
  InferCreationAttributes<ReviewMessage>
> {
  declare id: CreationOptional<number>
  declare reviewId: number
  declare kind: 'question' | 'answer'
  declare body: string
  declare authorUserId: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare author?: NonAttribute<User>
  declare attachments?: NonAttribute<ApplicationAttachment[]>

  static initModel(sequelize: Sequelize): void {
    ReviewMessage.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        reviewId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM('question', 'answer'), allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        authorUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'review_messages', underscored: true },
    )
  }
}
