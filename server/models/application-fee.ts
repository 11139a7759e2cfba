import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize'
import type {
  DurationClass,
  FeeLine,
  FeePurpose,
  FeeState,
  PaymentTerms,
} from '../../shared/types/fees.ts'
import type { FeeSchedule } from './fee-schedule.ts'

/** One charge on an application (application fee, or the fee of an extension or variation). */
export class ApplicationFee extends Model<
  InferAttributes<ApplicationFee>,
  InferCreationAttributes<ApplicationFee>
> {
  declare id: CreationOptional<number>
  declare applicationId: number
  declare feeScheduleId: number
  declare purpose: FeePurpose
  declare permitId: number | null
  declare durationClass: DurationClass | null
  declare workingDays: number | null
  declare lines: FeeLine[]
  declare amountCents: number
  declare currency: string
  declare paymentTerms: PaymentTerms
  declare state: FeeState
  declare refundDueCents: CreationOptional<number>
  declare refundedCents: CreationOptional<number>
  declare checkoutSessionId: string | null
  declare lastAttemptFailed: CreationOptional<boolean>
  declare paymentIntentId: string | null
  declare refundId: string | null
  /** Reference of a payment or refund made outside the payment service (invoice, bank transfer). */
  declare offlineReference: CreationOptional<string | null>
  declare paidAt: Date | null
  declare refundedAt: Date | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare schedule?: NonAttribute<FeeSchedule>

  static initModel(sequelize: Sequelize): void {
    ApplicationFee.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        applicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        feeScheduleId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        purpose: {
          type: DataTypes.ENUM('application', 'extension', 'variation'),
          allowNull: false,
        },
        permitId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        durationClass: { type: DataTypes.ENUM('minor', 'standard', 'major'), allowNull: true },
        workingDays: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        lines: { type: DataTypes.JSON, allowNull: false },
        amountCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        paymentTerms: { type: DataTypes.ENUM('pay_before_grant', 'invoice'), allowNull: false },
        state: {
          type: DataTypes.ENUM('due', 'paid', 'refund_due', 'refunded', 'cancelled', 'no_charge'),
          allowNull: false,
        },
        refundDueCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        refundedCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        checkoutSessionId: { type: DataTypes.STRING(255), allowNull: true },
        lastAttemptFailed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        paymentIntentId: { type: DataTypes.STRING(255), allowNull: true },
        refundId: { type: DataTypes.STRING(255), allowNull: true },
        offlineReference: { type: DataTypes.STRING(200), allowNull: true },
        paidAt: { type: DataTypes.DATE(3), allowNull: true },
        refundedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'application_fees', underscored: true },
    )
  }
}
