import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { z } from 'zod'
import { pagingQuerySchema } from '../../shared/schemas/paging.ts'
import {
  reviewDecisionSchema,
  reviewQueueQuerySchema,
  segmentRerunSchema,
} from '../../shared/schemas/reviews.ts'
import { allow } from '../middleware/access.ts'
import { decideReview, getReviewDetail, listMyReviews } from '../services/reviews.ts'
import { rerunSegment } from '../services/segment-reruns.ts'

const idParam = z.object({ id: z.coerce.number().int().positive() })
const rerunParams = idParam.extend({ assessmentId: z.coerce.number().int().positive() })

/** /api/reviews: an owner's engineer's queue, one review, decisions and segment re-runs. */
export function reviewsRouter(sequelize: Sequelize): Router {
  const router = Router()
  const engineers = allow(['asset_engineer'])

  router.get('/', engineers, async (req, res) => {
    const q = pagingQuerySchema.merge(reviewQueueQuerySchema).parse(req.query)
    res.json(await listMyReviews(req.user!, q))
  })

  router.get('/:id', engineers, async (req, res) => {
    res.json(await getReviewDetail(sequelize, req.user!, idParam.parse(req.params).id))
  })

  router.post('/:id/decision', engineers, async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(await decideReview(sequelize, req.user!, id, reviewDecisionSchema.parse(req.body)))
  })

  router.post('/:id/segments/:assessmentId/rerun', engineers, async (req, res) => {
    const { id, assessmentId } = rerunParams.parse(req.params)
    res
      .status(201)
      .json(
        await rerunSegment(
          sequelize,
          req.user!,
          id,
          assessmentId,
          segmentRerunSchema.parse(req.body),
        ),
      )
  })

  return router
}
