import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { SiteEventKind } from '../../shared/types/site-works.ts'
import { SITE_EVENT_KINDS } from '../../shared/types/site-works.ts'

/** A planned start, the actual start or the finish of the works on a granted permit. */
export class SiteEvent extends Model<
  InferAttributes<SiteEvent>,
  InferCreationAttributes<SiteEvent>
> {
  declare id: CreationOptional<number>
  declare applicationId: number
  declare permitId: number
  declare kind: SiteEventKind
  declare at: Date
  declare note: string | null
  declare recordedByUserId: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    SiteEvent.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        applicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        permitId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM(...SITE_EVENT_KINDS), allowNull: false },
        at: { type: DataTypes.DATE(3), allowNull: false },
        note: { type: DataTypes.STRING(2000), allowNull: true },
        recordedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'site_events', underscored: true },
    )
  }
}
