import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'

/** A receipt for a payment or a refund, with our own gap-free yearly number. */
export class Receipt extends Model<InferAttributes<Receipt>, InferCreationAttributes<Receipt>> {
  declare id: CreationOptional<number>
  declare number: string
  declare year: number
  declare sequence: number
  declare applicationFeeId: number
  declare kind: 'payment' | 'refund'
  declare amountCents: number
  declare currency: string
  declare pdfPath: string | null
  declare pdfSha256: string | null
  declare issuedAt: Date
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    Receipt.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        number: { type: DataTypes.STRING(32), allowNull: false },
        year: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        sequence: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        applicationFeeId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM('payment', 'refund'), allowNull: false },
        amountCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        pdfPath: { type: DataTypes.STRING(500), allowNull: true },
        pdfSha256: { type: DataTypes.CHAR(64), allowNull: true },
        issuedAt: { type: DataTypes.DATE(3), allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'receipts', underscored: true },
    )
  }
}
