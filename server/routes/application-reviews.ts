import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { z } from 'zod'
import { reviewAnswerSchema } from '../../shared/schemas/reviews.ts'
import { allow } from '../middleware/access.ts'
import { applicationHistory } from '../services/application-history.ts'
import { answerOwnerQuestion, listApplicationReviews } from '../services/application-reviews.ts'
import { listApplicationPermits } from '../services/permits.ts'

const idParam = z.object({ id: z.coerce.number().int().positive() })
const answerParams = idParam.extend({ reviewId: z.coerce.number().int().positive() })

/**
 * The review side of /api/applications/:id: the owners' decisions and questions as the
 * applicant sees them, answering a question, the permits and the history for the parties.
 */
export function applicationReviewsRouter(sequelize: Sequelize): Router {
  const router = Router()
  const parties = allow(['applicant', 'asset_engineer', 'permit_officer', 'admin'])

  router.get('/:id/reviews', allow(['applicant', 'permit_officer', 'admin']), async (req, res) => {
    res.json(await listApplicationReviews(req.user!, idParam.parse(req.params).id))
  })

  router.post('/:id/reviews/:reviewId/answer', allow(['applicant']), async (req, res) => {
    const { id, reviewId } = answerParams.parse(req.params)
    res.json(
      await answerOwnerQuestion(
        sequelize,
        req.user!,
        id,
        reviewId,
        reviewAnswerSchema.parse(req.body),
      ),
    )
  })

  router.get('/:id/permits', parties, async (req, res) => {
    res.json(await listApplicationPermits(req.user!, idParam.parse(req.params).id))
  })

  router.get('/:id/history', parties, async (req, res) => {
    res.json(await applicationHistory(req.user!, idParam.parse(req.params).id))
  })

  return router
}
