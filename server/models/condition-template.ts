import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { ConditionParameterDefinition } from '../../shared/types/condition-templates.ts'
import type { RequiredPhotoKind } from '../../shared/types/site-works.ts'

/** One standard condition of an owner's library, with placeholders in its text. */
export class ConditionTemplate extends Model<
  InferAttributes<ConditionTemplate>,
  InferCreationAttributes<ConditionTemplate>
> {
  declare id: CreationOptional<number>
  declare ownerOrganisationId: number
  declare code: string
  declare title: string
  declare text: string
  declare parameters: ConditionParameterDefinition[]
  declare active: CreationOptional<boolean>
  /** The owner attends the works and wants the planned start this many hours ahead. */
  declare attendanceNotice_h: CreationOptional<number | null>
  /** Photos the crew must upload before recording the works finished. */
  declare photoKinds: CreationOptional<RequiredPhotoKind[] | null>
  declare version: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    ConditionTemplate.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        ownerOrganisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        code: { type: DataTypes.STRING(64), allowNull: false },
        title: { type: DataTypes.STRING(160), allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        parameters: { type: DataTypes.JSON, allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        attendanceNotice_h: {
          type: DataTypes.SMALLINT.UNSIGNED,
          allowNull: true,
          field: 'attendance_notice_h',
        },
        photoKinds: { type: DataTypes.JSON, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'condition_templates', underscored: true },
    )
  }
}
