import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { ChangeReviewState } from '../../shared/types/site-works.ts'
import { CHANGE_REVIEW_STATES } from '../../shared/types/site-works.ts'

/** One touched owner's review of a permit change request. */
export class ChangeReview extends Model<
  InferAttributes<ChangeReview>,
  InferCreationAttributes<ChangeReview>
> {
  declare id: CreationOptional<number>
  declare changeRequestId: number
  declare ownerOrganisationId: number
  declare state: ChangeReviewState
  declare dueOn: string
  declare decidedByUserId: number | null
  declare decidedAt: Date | null
  declare reasons: string | null
  declare conditions: { code: string; text: string }[] | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    ChangeReview.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        changeRequestId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        ownerOrganisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        state: { type: DataTypes.ENUM(...CHANGE_REVIEW_STATES), allowNull: false },
        dueOn: { type: DataTypes.DATEONLY, allowNull: false },
        decidedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        decidedAt: { type: DataTypes.DATE(3), allowNull: true },
        reasons: { type: DataTypes.STRING(5000), allowNull: true },
        conditions: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'change_reviews', underscored: true },
    )
  }
}
