import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import {
  coordinationPeriodSchema,
  coordinationWorksQuerySchema,
} from '../../shared/schemas/coordination.ts'
import { allow } from '../middleware/access.ts'
import {
  coordinationClashes,
  coordinationTimeline,
  coordinationWorks,
} from '../services/coordination.ts'

/** /api/coordination: concurrent works in space and time, for the permit office. */
export function coordinationRouter(sequelize: Sequelize): Router {
  const router = Router()
  const office = allow(['permit_officer', 'admin'])

  router.get('/works', office, async (req, res) => {
    res.json(
      await coordinationWorks(sequelize, req.user!, coordinationWorksQuerySchema.parse(req.query)),
    )
  })

  router.get('/clashes', office, async (req, res) => {
    res.json(
      await coordinationClashes(sequelize, req.user!, coordinationPeriodSchema.parse(req.query)),
    )
  })

  router.get('/timeline', office, async (req, res) => {
    res.json(
      await coordinationTimeline(sequelize, req.user!, coordinationPeriodSchema.parse(req.query)),
    )
  })

  return router
}
