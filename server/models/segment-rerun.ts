import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'
import type { AssessmentInput, AssessmentResult, Verdict } from '../../shared/statics/types.ts'

/** An engine re-run of one affected segment with pipe data corrected by the owner's engineer. */
export class SegmentRerun extends Model<
  InferAttributes<SegmentRerun>,
  InferCreationAttributes<SegmentRerun>
> {
  declare id: CreationOptional<number>
  declare reviewId: number
  declare assessmentId: number
  declare engineInput: AssessmentInput
  declare result: AssessmentResult
  declare verdict: Verdict
  declare note: string | null
  declare engineVersion: string
  declare createdByUserId: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    SegmentRerun.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        reviewId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        assessmentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        engineInput: { type: DataTypes.JSON, allowNull: false },
        result: { type: DataTypes.JSON, allowNull: false },
        verdict: { type: DataTypes.ENUM('clear', 'conditional', 'critical'), allowNull: false },
        note: { type: DataTypes.STRING(1000), allowNull: true },
        engineVersion: { type: DataTypes.STRING(40), allowNull: false },
        createdByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'segment_reruns', underscored: true },
    )
  }
}
