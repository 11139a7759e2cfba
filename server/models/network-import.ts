import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { FieldIssue } from '../../shared/errors.ts'
import type { ImportMapping } from '../../shared/schemas/import-mapping.ts'
import type { FeatureIssue, ImportFormat, ImportStatus } from '../../shared/types/network.ts'

/** One import job: the uploaded file, the two passes' progress and the per-feature report. */
export class NetworkImport extends Model<
  InferAttributes<NetworkImport>,
  InferCreationAttributes<NetworkImport>
> {
  declare id: CreationOptional<number>
  declare ownerOrganisationId: number
  declare createdByUserId: number | null
  declare format: ImportFormat
  declare originalFilename: string
  declare filePath: string
  declare fileSha256: string
  declare fileSizeBytes: number
  declare status: ImportStatus
  declare skipInvalid: boolean | null
  declare mappingSnapshot: ImportMapping | null
  declare featuresTotal: CreationOptional<number>
  declare featuresProcessed: CreationOptional<number>
  declare featuresValid: CreationOptional<number>
  declare featuresInvalid: CreationOptional<number>
  declare segmentsInserted: CreationOptional<number>
  declare segmentsUpdated: CreationOptional<number>
  declare fileIssues: FieldIssue[] | null
  declare featureIssues: FeatureIssue[] | null
  declare featureIssuesTruncated: CreationOptional<boolean>
  declare errorMessage: string | null
  declare validatedAt: Date | null
  declare committedAt: Date | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    const count = (field: string) => ({
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      defaultValue: 0,
      field,
    })
    NetworkImport.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        ownerOrganisationId: {
          type: DataTypes.INTEGER.UNSIGNED,
          allowNull: false,
          field: 'owner_organisation_id',
        },
        createdByUserId: {
          type: DataTypes.INTEGER.UNSIGNED,
          allowNull: true,
          field: 'created_by_user_id',
        },
        format: { type: DataTypes.STRING(16), allowNull: false },
        originalFilename: {
          type: DataTypes.STRING(255),
          allowNull: false,
          field: 'original_filename',
        },
        filePath: { type: DataTypes.STRING(500), allowNull: false, field: 'file_path' },
        fileSha256: { type: DataTypes.CHAR(64), allowNull: false, field: 'file_sha256' },
        fileSizeBytes: {
          type: DataTypes.BIGINT.UNSIGNED,
          allowNull: false,
          field: 'file_size_bytes',
        },
        status: { type: DataTypes.STRING(16), allowNull: false },
        skipInvalid: { type: DataTypes.BOOLEAN, allowNull: true, field: 'skip_invalid' },
        mappingSnapshot: { type: DataTypes.JSON, allowNull: true, field: 'mapping_snapshot' },
        featuresTotal: count('features_total'),
        featuresProcessed: count('features_processed'),
        featuresValid: count('features_valid'),
        featuresInvalid: count('features_invalid'),
        segmentsInserted: count('segments_inserted'),
        segmentsUpdated: count('segments_updated'),
        fileIssues: { type: DataTypes.JSON, allowNull: true, field: 'file_issues' },
        featureIssues: { type: DataTypes.JSON, allowNull: true, field: 'feature_issues' },
        featureIssuesTruncated: {
          type: DataTypes.BOOLEAN,
          allowNull: false,
          defaultValue: false,
          field: 'feature_issues_truncated',
        },
        errorMessage: { type: DataTypes.STRING(500), allowNull: true, field: 'error_message' },
        validatedAt: { type: DataTypes.DATE(3), allowNull: true, field: 'validated_at' },
        committedAt: { type: DataTypes.DATE(3), allowNull: true, field: 'committed_at' },
        createdAt: { type: DataTypes.DATE(3), field: 'created_at' },
        updatedAt: { type: DataTypes.DATE(3), field: 'updated_at' },
      },
      { sequelize, tableName: 'network_imports', underscored: true },
    )
  }
}
