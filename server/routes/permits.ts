import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { z } from 'zod'
import {
  extendPermitSchema,
  revokePermitSchema,
  varyPermitSchema,
} from '../../shared/schemas/permits.ts'
import { allow } from '../middleware/access.ts'
import {
  extendPermit,
  getPermit,
  permitDocument,
  revokePermit,
  varyPermit,
} from '../services/permits.ts'

const idParam = z.object({ id: z.coerce.number().int().positive() })

/** /api/permits: one permit issue and its signed PDF for the parties; changes by the office. */
export function permitsRouter(sequelize: Sequelize): Router {
  const router = Router()
  const parties = allow(['applicant', 'asset_engineer', 'permit_officer', 'admin'])
  const officers = allow(['permit_officer'])

  router.get('/:id', parties, async (req, res) => {
    res.json(await getPermit(req.user!, idParam.parse(req.params).id))
  })

  router.get('/:id/document', parties, async (req, res) => {
    const { path, filename } = await permitDocument(req.user!, idParam.parse(req.params).id)
    res.setHeader('Content-Type', 'application/pdf')
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`)
    // The data folder may be a dot folder (.data); the path comes from our own row, not the request.
    res.sendFile(path, { dotfiles: 'allow' })
  })

  router.post('/:id/extend', officers, async (req, res) => {
    const { id } = idParam.parse(req.params)
    res
      .status(201)
      .json(await extendPermit(sequelize, req.user!, id, extendPermitSchema.parse(req.body)))
  })

  router.post('/:id/vary', officers, async (req, res) => {
    const { id } = idParam.parse(req.params)
    res
      .status(201)
      .json(await varyPermit(sequelize, req.user!, id, varyPermitSchema.parse(req.body)))
  })

  router.post('/:id/revoke', officers, async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(await revokePermit(sequelize, req.user!, id, revokePermitSchema.parse(req.body)))
  })

  return router
}
