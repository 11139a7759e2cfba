import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { SitePackTick } from '../../shared/types/site-works.ts'

/** The crew's ticks against the conditions of one permit issue. */
export class SiteChecklist extends Model<
  InferAttributes<SiteChecklist>,
  InferCreationAttributes<SiteChecklist>
> {
  declare id: CreationOptional<number>
  declare permitId: number
  declare ticks: Record<string, SitePackTick>
  declare updatedByUserId: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    SiteChecklist.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        permitId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        ticks: { type: DataTypes.JSON, allowNull: false },
        updatedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'site_checklists', underscored: true },
    )
  }
}
