import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { z } from 'zod'
import { pagingQuerySchema } from '../../shared/schemas/paging.ts'
import { grantPermitSchema, refuseApplicationSchema } from '../../shared/schemas/permits.ts'
import { allow } from '../middleware/access.ts'
import {
  decisionDraft,
  grantPermit,
  officeApplication,
  officeQueue,
  refuseApplication,
} from '../services/permit-office.ts'

const idParam = z.object({ id: z.coerce.number().int().positive() })
const queueQuery = pagingQuerySchema.extend({
  status: z.enum(['open', 'decided', 'all']).default('open'),
})

/** /api/permit-office: the officer's queue, one application, grant and refuse. */
export function permitOfficeRouter(sequelize: Sequelize): Router {
  const router = Router()
  const officers = allow(['permit_officer', 'admin'])
  const officersOnly = allow(['permit_officer'])

  router.get('/queue', officers, async (req, res) => {
    res.json(await officeQueue(req.user!, queueQuery.parse(req.query)))
  })

  router.get('/applications/:id', officers, async (req, res) => {
    res.json(await officeApplication(sequelize, req.user!, idParam.parse(req.params).id))
  })

  router.get('/applications/:id/decision-draft', officers, async (req, res) => {
    res.json(await decisionDraft(req.user!, idParam.parse(req.params).id))
  })

  router.post('/applications/:id/grant', officersOnly, async (req, res) => {
    const { id } = idParam.parse(req.params)
    res
      .status(201)
      .json(await grantPermit(sequelize, req.user!, id, grantPermitSchema.parse(req.body)))
  })

  router.post('/applications/:id/refuse', officersOnly, async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(
      await refuseApplication(sequelize, req.user!, id, refuseApplicationSchema.parse(req.body)),
    )
  })

  return router
}
