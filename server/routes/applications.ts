import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { z } from 'zod'
import {
  applicationDraftSchema,
  applicationUpdateSchema,
} from '../../shared/schemas/application.ts'
import { pagingQuerySchema } from '../../shared/schemas/paging.ts'
import { APPLICATION_STATUSES } from '../../shared/types/application.ts'
import { allow } from '../middleware/access.ts'
import {
  createDraft,
  getApplication,
  getScreening,
  listApplications,
  submitApplication,
  updateDraft,
  withdrawApplication,
} from '../services/applications.ts'

const idParam = z.object({ id: z.coerce.number().int().positive() })
const listQuery = pagingQuerySchema.extend({
  status: z.enum(APPLICATION_STATUSES).optional(),
  q: z.string().trim().max(100).optional(),
})

/** Applications: drafts, submit, withdraw, lists. Screening hooks in at submit. */
export function applicationsRouter(sequelize: Sequelize): Router {
  const router = Router()
  const applicantOnly = allow(['applicant'])
  const readers = allow(['applicant', 'permit_officer', 'admin'])

  router.get('/', readers, async (req, res) => {
    res.json(await listApplications(req.user!, listQuery.parse(req.query)))
  })

  router.post('/', applicantOnly, async (req, res) => {
    res
      .status(201)
      .json(await createDraft(sequelize, req.user!, applicationDraftSchema.parse(req.body)))
  })

  router.get('/:id', readers, async (req, res) => {
    res.json(await getApplication(req.user!, idParam.parse(req.params).id))
  })

  router.get('/:id/screening', readers, async (req, res) => {
    res.json(await getScreening(sequelize, req.user!, idParam.parse(req.params).id))
  })

  router.put('/:id', applicantOnly, async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(await updateDraft(sequelize, req.user!, id, applicationUpdateSchema.parse(req.body)))
  })

  router.post('/:id/submit', applicantOnly, async (req, res) => {
    const { id } = idParam.parse(req.params)
    const { version } = z.object({ version: z.number().int().min(0) }).parse(req.body)
    res.json(await submitApplication(sequelize, req.user!, id, version))
  })

  router.post('/:id/withdraw', applicantOnly, async (req, res) => {
    const { id } = idParam.parse(req.params)
    const { reason } = z
      .object({ reason: z.string().trim().max(1000).optional() })
      .parse(req.body ?? {})
    res.json(await withdrawApplication(sequelize, req.user!, id, reason))
  })

  return router
}
