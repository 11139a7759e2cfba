import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type {
  PermitChangeKind,
  PermitCondition,
  StoredPermitStatus,
} from '../../shared/types/permits.ts'

/** One issue of a permit (issue 1 on grant; a new issue per extension or variation). */
export class Permit extends Model<InferAttributes<Permit>, InferCreationAttributes<Permit>> {
  declare id: CreationOptional<number>
  declare number: string
  declare issue: number
  declare applicationId: number
  declare status: StoredPermitStatus
  declare changeKind: PermitChangeKind
  declare changeReason: string | null
  declare validFrom: string
  declare validTo: string
  declare conditions: PermitCondition[]
  declare verificationCode: string
  declare pdfPath: string | null
  declare pdfSha256: string | null
  declare issuedByUserId: number
  declare issuedAt: Date
  declare supersedesPermitId: number | null
  declare supersededAt: Date | null
  declare revokedAt: Date | null
  declare revokedByUserId: number | null
  declare revokedReason: string | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    Permit.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        number: { type: DataTypes.STRING(32), allowNull: false },
        issue: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        applicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        status: {
          type: DataTypes.ENUM('valid', 'revoked', 'expired', 'superseded'),
          allowNull: false,
        },
        changeKind: { type: DataTypes.ENUM('granted', 'extended', 'varied'), allowNull: false },
        changeReason: { type: DataTypes.STRING(2000), allowNull: true },
        validFrom: { type: DataTypes.DATEONLY, allowNull: false },
        validTo: { type: DataTypes.DATEONLY, allowNull: false },
        conditions: { type: DataTypes.JSON, allowNull: false },
        verificationCode: { type: DataTypes.STRING(16), allowNull: false },
        pdfPath: { type: DataTypes.STRING(500), allowNull: true },
        pdfSha256: { type: DataTypes.CHAR(64), allowNull: true },
        issuedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        issuedAt: { type: DataTypes.DATE(3), allowNull: false },
        supersedesPermitId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        supersededAt: { type: DataTypes.DATE(3), allowNull: true },
        revokedAt: { type: DataTypes.DATE(3), allowNull: true },
        revokedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        revokedReason: { type: DataTypes.STRING(2000), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'permits', underscored: true },
    )
  }
}
