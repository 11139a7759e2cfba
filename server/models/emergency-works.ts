import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { ActivityKind } from '../../shared/schemas/application.ts'

/** An alerted owner of emergency works: how many of its segments lie near and how near. */
export interface AlertedOwner {
  id: number
  name: string
  segments: number
  nearest_m: number
}

/** Urgent repairs started before any permit; the full application follows. */
export class EmergencyWorks extends Model<
  InferAttributes<EmergencyWorks>,
  InferCreationAttributes<EmergencyWorks>
> {
  declare id: CreationOptional<number>
  declare reference: string | null
  declare applicantOrganisationId: number
  declare createdByUserId: number
  declare location: { type: string; coordinates: unknown }
  declare siteAddress: string
  declare activityKind: ActivityKind
  declare depth_m: number | null
  declare reason: string
  declare contactName: string
  declare contactPhone: string
  declare startedAt: Date
  declare followUpDueAt: Date
  declare followUpApplicationId: number | null
  declare alertedOwners: AlertedOwner[]
  declare finishedAt: Date | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    EmergencyWorks.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        reference: { type: DataTypes.STRING(24), allowNull: true },
        applicantOrganisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        location: { type: DataTypes.JSON, allowNull: false },
        siteAddress: { type: DataTypes.STRING(240), allowNull: false },
        activityKind: { type: DataTypes.ENUM('excavation', 'crane', 'fill'), allowNull: false },
        depth_m: { type: DataTypes.DECIMAL(6, 2), allowNull: true, field: 'depth_m' },
        reason: { type: DataTypes.STRING(2000), allowNull: false },
        contactName: { type: DataTypes.STRING(160), allowNull: false },
        contactPhone: { type: DataTypes.STRING(40), allowNull: false },
        startedAt: { type: DataTypes.DATE(3), allowNull: false },
        followUpDueAt: { type: DataTypes.DATE(3), allowNull: false },
        followUpApplicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        alertedOwners: { type: DataTypes.JSON, allowNull: false },
        finishedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'emergency_works', underscored: true },
    )
  }
}
