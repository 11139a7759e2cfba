import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { ActivityInput, ActivityKind } from '../../shared/schemas/application.ts'

/**
 * One activity of an application. `input` is what the applicant entered (geometry in WGS84);
 * the projected geometry column `geom` is written with raw SQL (services/activities-store.ts)
 * because Sequelize cannot set its SRID, and is not mapped here.
 */
export class Activity extends Model<InferAttributes<Activity>, InferCreationAttributes<Activity>> {
  declare id: CreationOptional<number>
  declare applicationId: number
  declare position: number
  declare kind: ActivityKind
  declare label: string | null
  declare input: ActivityInput
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    Activity.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        applicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        position: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM('excavation', 'crane', 'fill'), allowNull: false },
        label: { type: DataTypes.STRING(120), allowNull: true },
        input: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'activities', underscored: true },
    )
  }
}
