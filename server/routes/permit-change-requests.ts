import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { z } from 'zod'
import {
  changeRequestDecisionSchema,
  changeRequestSchema,
  changeReviewDecisionSchema,
} from '../../shared/schemas/site-works.ts'
import { allow } from '../middleware/access.ts'
import {
  createChangeRequest,
  decideChangeRequest,
  decideChangeReview,
  getChangeRequest,
  listApplicationChangeRequests,
  listChangeRequests,
  withdrawChangeRequest,
} from '../services/permit-change-requests.ts'

const idParam = z.object({ id: z.coerce.number().int().positive() })

/**
 * /api/change-requests: the applicant's requests to extend or vary a granted permit, the
 * touched owners' answers and the office's decision.
 */
export function changeRequestsRouter(sequelize: Sequelize): Router {
  const router = Router()
  const parties = allow(['applicant', 'asset_engineer', 'permit_officer', 'admin'])

  router.get('/', allow(['asset_engineer', 'permit_officer', 'admin']), async (req, res) => {
    res.json({ items: await listChangeRequests(req.user!) })
  })

  router.get('/for-application/:id', parties, async (req, res) => {
    res.json({
      items: await listApplicationChangeRequests(req.user!, idParam.parse(req.params).id),
    })
  })

  router.post('/for-application/:id', allow(['applicant']), async (req, res) => {
    const { id } = idParam.parse(req.params)
    res
      .status(201)
      .json(
        await createChangeRequest(sequelize, req.user!, id, changeRequestSchema.parse(req.body)),
      )
  })

  router.get('/:id', parties, async (req, res) => {
    res.json(await getChangeRequest(req.user!, idParam.parse(req.params).id))
  })

  router.post('/:id/review', allow(['asset_engineer']), async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(
      await decideChangeReview(
        sequelize,
        req.user!,
        id,
        changeReviewDecisionSchema.parse(req.body),
      ),
    )
  })

  router.post('/:id/decision', allow(['permit_officer']), async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(
      await decideChangeRequest(
        sequelize,
        req.user!,
        id,
        changeRequestDecisionSchema.parse(req.body),
      ),
    )
  })

  router.post('/:id/withdraw', allow(['applicant']), async (req, res) => {
    res.json(await withdrawChangeRequest(req.user!, idParam.parse(req.params).id))
  })

  return router
}
