import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize'
import type { FeeEntry, PaymentTerms } from '../../shared/types/fees.ts'
import type { Organisation } from './organisation.ts'
import type { User } from './user.ts'

/** One version of a street authority's fee schedule (never edited once saved). */
export class FeeSchedule extends Model<
  InferAttributes<FeeSchedule>,
  InferCreationAttributes<FeeSchedule>
> {
  declare id: CreationOptional<number>
  declare authorityOrganisationId: number
  declare effectiveFrom: string
  declare currency: string
  declare entries: FeeEntry[]
  declare variationFeeCents: number
  declare extensionFeeCents: number
  /** DECIMAL: the driver returns a string; read through Number(). */
  declare refundBeforeReviewPercent: number | string
  declare refundAfterReviewPercent: number | string
  declare defaultPaymentTerms: PaymentTerms
  declare note: string | null
  declare createdByUserId: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare authority?: NonAttribute<Organisation>
  declare createdBy?: NonAttribute<User>

  static initModel(sequelize: Sequelize): void {
    FeeSchedule.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        authorityOrganisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        effectiveFrom: { type: DataTypes.DATEONLY, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        entries: { type: DataTypes.JSON, allowNull: false },
        variationFeeCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        extensionFeeCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        refundBeforeReviewPercent: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
        refundAfterReviewPercent: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
        defaultPaymentTerms: {
          type: DataTypes.ENUM('pay_before_grant', 'invoice'),
          allowNull: false,
        },
        note: { type: DataTypes.STRING(2000), allowNull: true },
        createdByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'fee_schedules', underscored: true },
    )
  }
}
