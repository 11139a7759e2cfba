import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'

/** One e-mailed password-reset link; the token itself is never stored, only its SHA-256. */
export class PasswordReset extends Model<
  InferAttributes<PasswordReset>,
  InferCreationAttributes<PasswordReset>
> {
  declare id: CreationOptional<number>
  declare userId: number
  declare tokenSha256: string
  declare expiresAt: Date
  declare usedAt: Date | null
  declare requestedIp: string | null
  declare createdAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    PasswordReset.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        tokenSha256: { type: DataTypes.CHAR(64), allowNull: false },
        expiresAt: { type: DataTypes.DATE(3), allowNull: false },
        usedAt: { type: DataTypes.DATE(3), allowNull: true },
        requestedIp: { type: DataTypes.STRING(64), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      {
        sequelize,
        tableName: 'password_resets',
        underscored: true,
        timestamps: true,
        updatedAt: false,
      },
    )
  }
}
