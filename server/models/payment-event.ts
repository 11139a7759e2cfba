import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'

/** A webhook event from the payment service that we acted on (unique by event id). */
export class PaymentEvent extends Model<
  InferAttributes<PaymentEvent>,
  InferCreationAttributes<PaymentEvent>
> {
  declare id: CreationOptional<number>
  declare eventId: string
  declare type: string
  declare objectId: string | null
  declare applicationFeeId: number | null
  declare outcome: string
  declare receivedAt: Date

  static initModel(sequelize: Sequelize): void {
    PaymentEvent.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        eventId: { type: DataTypes.STRING(255), allowNull: false },
        type: { type: DataTypes.STRING(120), allowNull: false },
        objectId: { type: DataTypes.STRING(255), allowNull: true },
        applicationFeeId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        outcome: { type: DataTypes.STRING(500), allowNull: false },
        receivedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'payment_events', underscored: true, timestamps: false },
    )
  }
}
