import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize'
import type { DecidedCondition, ReviewDecisionKind } from '../../shared/types/reviews.ts'
import { REVIEW_DECISION_KINDS } from '../../shared/types/reviews.ts'
import type { User } from './user.ts'

/** One decision on a review; never changed except for being marked superseded. */
export class ReviewDecision extends Model<
  InferAttributes<ReviewDecision>,
  InferCreationAttributes<ReviewDecision>
> {
  declare id: CreationOptional<number>
  declare reviewId: number
  declare decision: ReviewDecisionKind
  declare reasons: string | null
  declare conditions: DecidedCondition[] | null
  declare decidedByUserId: number
  declare decidedAt: Date
  declare supersedesDecisionId: number | null
  declare supersededAt: Date | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare decidedBy?: NonAttribute<User>

  static initModel(sequelize: Sequelize): void {
    ReviewDecision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        reviewId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        decision: { type: DataTypes.ENUM(...REVIEW_DECISION_KINDS), allowNull: false },
        reasons: { type: DataTypes.TEXT, allowNull: true },
        conditions: { type: DataTypes.JSON, allowNull: true },
        decidedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        decidedAt: { type: DataTypes.DATE(3), allowNull: false },
        supersedesDecisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        supersededAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'review_decisions', underscored: true },
    )
  }
}
