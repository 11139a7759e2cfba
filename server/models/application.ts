import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize'
import type { ApplicationStatus } from '../../shared/types/application.ts'
import { APPLICATION_STATUSES } from '../../shared/types/application.ts'
import type { Activity } from './activity.ts'
import type { Organisation } from './organisation.ts'
import type { User } from './user.ts'

/** An application for permission to work near buried pipes. */
export class Application extends Model<
  InferAttributes<Application>,
  InferCreationAttributes<Application>
> {
  declare id: CreationOptional<number>
  declare reference: string | null
  declare status: CreationOptional<ApplicationStatus>
  declare version: CreationOptional<number>
  declare title: string
  declare siteAddress: string | null
  declare contactName: string | null
  declare contactPhone: string | null
  declare startsOn: string | null
  declare endsOn: string | null
  declare description: string | null
  declare applicantOrganisationId: number
  declare createdByUserId: number
  declare submittedAt: Date | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare activities?: NonAttribute<Activity[]>
  declare applicantOrganisation?: NonAttribute<Organisation>
  declare createdBy?: NonAttribute<User>

  static initModel(sequelize: Sequelize): void {
    Application.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        reference: { type: DataTypes.STRING(24), allowNull: true },
        status: {
          type: DataTypes.ENUM(...APPLICATION_STATUSES),
          allowNull: false,
          defaultValue: 'draft',
        },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        title: { type: DataTypes.STRING(160), allowNull: false },
        siteAddress: { type: DataTypes.STRING(240), allowNull: true },
        contactName: { type: DataTypes.STRING(160), allowNull: true },
        contactPhone: { type: DataTypes.STRING(40), allowNull: true },
        startsOn: { type: DataTypes.DATEONLY, allowNull: true },
        endsOn: { type: DataTypes.DATEONLY, allowNull: true },
        description: { type: DataTypes.TEXT, allowNull: true },
        applicantOrganisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        submittedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'applications', underscored: true },
    )
  }
}
