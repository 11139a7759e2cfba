import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { z } from 'zod'
import { emergencyFollowUpSchema, emergencyWorksSchema } from '../../shared/schemas/site-works.ts'
import { allow } from '../middleware/access.ts'
import {
  linkFollowUp,
  listEmergencyWorks,
  reportEmergencyWorks,
} from '../services/emergency-works.ts'

const idParam = z.object({ id: z.coerce.number().int().positive() })

/** /api/emergency-works: urgent repairs reported at once, with the full application to follow. */
export function emergencyWorksRouter(sequelize: Sequelize): Router {
  const router = Router()

  router.get(
    '/',
    allow(['applicant', 'asset_engineer', 'permit_officer', 'admin']),
    async (req, res) => {
      res.json({ items: await listEmergencyWorks(req.user!) })
    },
  )

  router.post('/', allow(['applicant']), async (req, res) => {
    res
      .status(201)
      .json(await reportEmergencyWorks(sequelize, req.user!, emergencyWorksSchema.parse(req.body)))
  })

  router.post('/:id/follow-up', allow(['applicant']), async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(await linkFollowUp(req.user!, id, emergencyFollowUpSchema.parse(req.body)))
  })

  return router
}
