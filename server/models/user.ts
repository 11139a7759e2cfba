import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  ForeignKey,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize'
import type { Role } from '../../shared/types/roles.ts'
import type { Organisation } from './organisation.ts'

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>
  declare email: string
  declare name: string
  declare passwordHash: string
  declare role: Role
  declare organisationId: ForeignKey<Organisation['id']>
  declare active: CreationOptional<boolean>
  declare failedSignIns: CreationOptional<number>
  declare lockedUntil: Date | null
  declare lastSignInAt: Date | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare organisation?: NonAttribute<Organisation>

  static initModel(sequelize: Sequelize): void {
    User.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        name: { type: DataTypes.STRING(160), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false },
        role: {
          type: DataTypes.ENUM('applicant', 'asset_engineer', 'permit_officer', 'admin'),
          allowNull: false,
        },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        failedSignIns: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        lockedUntil: { type: DataTypes.DATE, allowNull: true },
        lastSignInAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', underscored: true },
    )
  }
}
