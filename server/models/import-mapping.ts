import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { ImportMapping as ImportMappingValue } from '../../shared/schemas/import-mapping.ts'

/** A network owner's saved import mapping (one per owner). */
export class ImportMapping extends Model<
  InferAttributes<ImportMapping>,
  InferCreationAttributes<ImportMapping>
> {
  declare id: CreationOptional<number>
  declare ownerOrganisationId: number
  declare mapping: ImportMappingValue
  declare updatedByUserId: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    ImportMapping.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        ownerOrganisationId: {
          type: DataTypes.INTEGER.UNSIGNED,
          allowNull: false,
          field: 'owner_organisation_id',
        },
        mapping: { type: DataTypes.JSON, allowNull: false },
        updatedByUserId: {
          type: DataTypes.INTEGER.UNSIGNED,
          allowNull: true,
          field: 'updated_by_user_id',
        },
        createdAt: { type: DataTypes.DATE(3), field: 'created_at' },
        updatedAt: { type: DataTypes.DATE(3), field: 'updated_at' },
      },
      { sequelize, tableName: 'import_mappings', underscored: true },
    )
  }
}
