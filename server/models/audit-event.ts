import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize'
import type { User } from './user.ts'

/** One entry of the audit trail: who did what, when, on which record. Never updated. */
export class AuditEvent extends Model<
  InferAttributes<AuditEvent>,
  InferCreationAttributes<AuditEvent>
> {
  declare id: CreationOptional<number>
  declare at: Date
  declare actorUserId: number | null
  declare action: string
  declare entityType: string
  declare entityId: string | null
  declare details: Record<string, unknown> | null
  declare ip: string | null
  declare actor?: NonAttribute<User | null>

  static initModel(sequelize: Sequelize): void {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        at: { type: DataTypes.DATE(3), allowNull: false },
        actorUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        action: { type: DataTypes.STRING(64), allowNull: false },
        entityType: { type: DataTypes.STRING(64), allowNull: false },
        entityId: { type: DataTypes.STRING(64), allowNull: true },
        details: { type: DataTypes.JSON, allowNull: true },
        ip: { type: DataTypes.STRING(64), allowNull: true },
      },
      { sequelize, tableName: 'audit_events', underscored: true, timestamps: false },
    )
  }
}
