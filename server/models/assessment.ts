import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { AssessmentInput, AssessmentResult, Verdict } from '../../shared/statics/types.ts'
import type { StoredCombinedScreening } from '../../shared/types/coordination.ts'

/** The screening result of one application for one pipe segment. */
export class Assessment extends Model<
  InferAttributes<Assessment>,
  InferCreationAttributes<Assessment>
> {
  declare id: CreationOptional<number>
  declare applicationId: number
  declare pipeSegmentId: number
  declare ownerOrganisationId: number
  declare medium: string
  declare verdict: Verdict
  declare governingCheck: string | null
  declare utilisationBaseline: number | null
  declare utilisationWithWorks: number | null
  declare distance_m: number
  declare pieceIndex: number
  declare engineInput: AssessmentInput
  declare result: AssessmentResult
  declare engineVersion: string
  /** Worst verdict together with concurrent works on this segment; null when none overlap. */
  declare combinedVerdict: CreationOptional<Verdict> | null
  declare combined: CreationOptional<StoredCombinedScreening> | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    Assessment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        applicationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        pipeSegmentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        ownerOrganisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        medium: { type: DataTypes.STRING(32), allowNull: false },
        verdict: { type: DataTypes.ENUM('clear', 'conditional', 'critical'), allowNull: false },
        governingCheck: { type: DataTypes.STRING(32), allowNull: true },
        utilisationBaseline: { type: DataTypes.DOUBLE, allowNull: true },
        utilisationWithWorks: { type: DataTypes.DOUBLE, allowNull: true },
        distance_m: { type: DataTypes.DOUBLE, allowNull: false, field: 'distance_m' },
        pieceIndex: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        engineInput: { type: DataTypes.JSON, allowNull: false },
        result: { type: DataTypes.JSON, allowNull: false },
        engineVersion: { type: DataTypes.STRING(40), allowNull: false },
        combinedVerdict: {
          type: DataTypes.ENUM('clear', 'conditional', 'critical'),
          allowNull: true,
        },
        combined: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'assessments', underscored: true },
    )
  }
}
