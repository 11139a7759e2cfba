import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import type { ChangeOwnerScreening, ChangeRequestState } from '../../shared/types/site-works.ts'
import { CHANGE_REQUEST_STATES } from '../../shared/types/site-works.ts'

/** An applicant's request to extend or vary a granted permit. */
export class PermitChangeRequest extends Model<
  InferAttributes<PermitChangeRequest>,
  InferCreationAttributes<PermitChangeRequest>
> {
  declare id: CreationOptional<number>
  declare applicationId: number
  declare permitId: number
  declare status: ChangeRequestState
  declare validTo: string | null
  declare activities: ActivityInput[] | null
  declare reason: string
  declare screening: ChangeOwnerScreening[]
  declare createdByUserId: number
  declare decidedByUserId: number | null
  declare decidedAt: Date | null
  declare decisionNote: string | null
  declare resultPermitId: number | null
  declare version: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    PermitChangeRequest.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        applicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        permitId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        status: { type: DataTypes.ENUM(...CHANGE_REQUEST_STATES), allowNull: false },
        validTo: { type: DataTypes.DATEONLY, allowNull: true },
        activities: { type: DataTypes.JSON, allowNull: true },
        reason: { type: DataTypes.STRING(2000), allowNull: false },
        screening: { type: DataTypes.JSON, allowNull: false },
        createdByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        decidedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        decidedAt: { type: DataTypes.DATE(3), allowNull: true },
        decisionNote: { type: DataTypes.STRING(2000), allowNull: true },
        resultPermitId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'permit_change_requests', underscored: true },
    )
  }
}
