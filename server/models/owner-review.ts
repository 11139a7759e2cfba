import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize'
import type { DecidedCondition, ReviewState } from '../../shared/types/reviews.ts'
import { REVIEW_STATES } from '../../shared/types/reviews.ts'
import type { Organisation } from './organisation.ts'

/** One network owner's review of one application. */
export class OwnerReview extends Model<
  InferAttributes<OwnerReview>,
  InferCreationAttributes<OwnerReview>
> {
  declare id: CreationOptional<number>
  declare applicationId: number
  declare ownerOrganisationId: number
  declare state: ReviewState
  declare affectedSegmentCount: number
  declare worstVerdict: string | null
  declare openedOn: string
  declare dueOn: string | null
  declare pausedAt: Date | null
  declare remainingWorkingDays: number | null
  declare version: CreationOptional<number>
  declare decidedByUserId: number | null
  declare decidedAt: Date | null
  declare reasons: string | null
  declare conditions: DecidedCondition[] | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare owner?: NonAttribute<Organisation>

  static initModel(sequelize: Sequelize): void {
    OwnerReview.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        applicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        ownerOrganisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        state: { type: DataTypes.ENUM(...REVIEW_STATES), allowNull: false },
        affectedSegmentCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        worstVerdict: { type: DataTypes.STRING(16), allowNull: true },
        openedOn: { type: DataTypes.DATEONLY, allowNull: false },
        dueOn: { type: DataTypes.DATEONLY, allowNull: true },
        pausedAt: { type: DataTypes.DATE(3), allowNull: true },
        remainingWorkingDays: { type: DataTypes.INTEGER, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        decidedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        decidedAt: { type: DataTypes.DATE(3), allowNull: true },
        reasons: { type: DataTypes.TEXT, allowNull: true },
        conditions: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'owner_reviews', underscored: true },
    )
  }
}
