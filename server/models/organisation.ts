import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { OrganisationKind } from '../../shared/types/roles.ts'

export class Organisation extends Model<
  InferAttributes<Organisation>,
  InferCreationAttributes<Organisation>
> {
  declare id: CreationOptional<number>
  declare name: string
  declare kind: OrganisationKind
  declare medium: string | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    Organisation.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        kind: {
          type: DataTypes.ENUM('contractor', 'network_owner', 'street_authority', 'operator'),
          allowNull: false,
        },
        medium: { type: DataTypes.STRING(32), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'organisations', underscored: true },
    )
  }
}
