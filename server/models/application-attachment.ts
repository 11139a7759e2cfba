import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { AttachmentKind } from '../../shared/types/attachments.ts'
import { ATTACHMENT_KINDS } from '../../shared/types/attachments.ts'

/** A document attached to an application; the file lives in the upload folder under `storageName`. */
export class ApplicationAttachment extends Model<
  InferAttributes<ApplicationAttachment>,
  InferCreationAttributes<ApplicationAttachment>
> {
  declare id: CreationOptional<number>
  declare applicationId: number
  declare kind: AttachmentKind
  declare originalFilename: string
  declare contentType: string
  declare sizeBytes: number
  declare sha256: string
  declare storageName: string
  declare uploadedByUserId: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    ApplicationAttachment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        applicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM(...ATTACHMENT_KINDS), allowNull: false },
        originalFilename: { type: DataTypes.STRING(255), allowNull: false },
        contentType: { type: DataTypes.STRING(64), allowNull: false },
        sizeBytes: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        storageName: { type: DataTypes.STRING(80), allowNull: false },
        uploadedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'application_attachments', underscored: true },
    )
  }
}
