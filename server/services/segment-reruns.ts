import type { Sequelize } from 'sequelize'
import type { SegmentRerunInput } from '../../shared/schemas/reviews.ts'
import { assessPipe } from '../../shared/statics/index.ts'
import type { AssessmentInput } from '../../shared/statics/types.ts'
import type { SegmentRerunDto } from '../../shared/types/reviews.ts'
import { domainRule, forbidden, notFound } from '../errors.ts'
import { Assessment, OwnerReview, SegmentRerun, User } from '../models/index.ts'
import { recordAudit } from './audit.ts'
import { BASELINE_ENGINE_VERSION } from './pipe-baseline.ts'
import { parseJson } from './review-dto.ts'
import { toRerunDto } from './reviews.ts'

/**
 * Re-run the engine for one affected segment of the engineer's own review with corrected pipe
 * design data. The activities are the ones the screening placed in that segment's pipe-local
 * frame (stored with the assessment), so only the pipe data differ. The screening result stays
 * as it was; the re-run is stored as its own record, listed with the segment.
 */
export async function rerunSegment(
  sequelize: Sequelize,
  user: User,
  reviewId: number,
  assessmentId: number,
  input: SegmentRerunInput,
): Promise<SegmentRerunDto> {
  if (user.role !== 'asset_engineer') throw forbidden()
  const review = await OwnerReview.findByPk(reviewId)
  if (
    !review ||
    review.ownerOrganisationId !== user.organisationId ||
    review.state === 'not_affected'
  ) {
    throw notFound('review', reviewId)
  }
  const assessment = await Assessment.findByPk(assessmentId)
  if (
    !assessment ||
    assessment.applicationId !== review.applicationId ||
    assessment.ownerOrganisationId !== review.ownerOrganisationId
  ) {
    throw notFound('affected segment', assessmentId)
  }
  const stored = parseJson<AssessmentInput>(assessment.engineInput)
  const engineInput: AssessmentInput = { pipe: input.pipe, activities: stored.activities }
  let result
  try {
    result = assessPipe(engineInput)
  } catch (err) {
    if (err instanceof RangeError)
      throw domainRule(`The engine cannot use these data: ${err.message}`)
    throw err
  }
  const id = await sequelize.transaction(async (transaction) => {
    const row = await SegmentRerun.create(
      {
        reviewId,
        assessmentId,
        engineInput,
        result,
        verdict: result.verdict,
        note: input.note ?? null,
        engineVersion: BASELINE_ENGINE_VERSION,
        createdByUserId: user.id,
      },
      { transaction },
    )
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'segment-rerun',
        entityType: 'owner_review',
        entityId: reviewId,
        details: {
          applicationId: review.applicationId,
          ownerOrganisationId: review.ownerOrganisationId,
          assessmentId,
          rerunId: row.id,
          verdict: result.verdict,
          screenedVerdict: assessment.verdict,
        },
      },
      transaction,
    )
    return row.id
  })
  const row = await SegmentRerun.findByPk(id, {
    include: [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }],
  })
  return toRerunDto(row!)
}
