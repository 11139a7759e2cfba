import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { SitePhotoKind } from '../../shared/types/site-works.ts'
import { SITE_PHOTO_KINDS } from '../../shared/types/site-works.ts'

/** A photo from site; the file lives in UPLOAD_DIR/site-photos under `storageName`. */
export class SitePhoto extends Model<
  InferAttributes<SitePhoto>,
  InferCreationAttributes<SitePhoto>
> {
  declare id: CreationOptional<number>
  declare applicationId: number
  declare kind: SitePhotoKind
  declare caption: string | null
  declare originalFilename: string
  declare contentType: string
  declare sizeBytes: number
  declare sha256: string
  declare storageName: string
  declare uploadedByUserId: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    SitePhoto.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        applicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM(...SITE_PHOTO_KINDS), allowNull: false },
        caption: { type: DataTypes.STRING(300), allowNull: true },
        originalFilename: { type: DataTypes.STRING(255), allowNull: false },
        contentType: { type: DataTypes.STRING(40), allowNull: false },
        sizeBytes: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        storageName: { type: DataTypes.STRING(80), allowNull: false },
        uploadedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'site_photos', underscored: true },
    )
  }
}
