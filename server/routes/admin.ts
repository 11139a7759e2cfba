import { Router } from 'express'
import { z } from 'zod'
import {
  createOrganisationSchema,
  createUserSchema,
  updateUserSchema,
} from '../../shared/schemas/auth.ts'
import { pagingQuerySchema } from '../../shared/schemas/paging.ts'
import { config } from '../config.ts'
import { notFound } from '../errors.ts'
import { allow } from '../middleware/access.ts'
import { listAudit } from '../services/audit.ts'
import { listCaughtMail } from '../mail/caught-mail.ts'
import {
  createOrganisation,
  createUser,
  listOrganisations,
  listUsers,
  updateUser,
} from '../services/users.ts'

export const adminRouter = Router()
const adminOnly = allow(['admin'])
const idParam = z.object({ id: z.coerce.number().int().positive() })

adminRouter.get('/organisations', adminOnly, async (_req, res) => {
  res.json({ items: await listOrganisations() })
})

adminRouter.post('/organisations', adminOnly, async (req, res) => {
  const input = createOrganisationSchema.parse(req.body)
  res.status(201).json(await createOrganisation(input, req.user!.id))
})

adminRouter.get('/users', adminOnly, async (_req, res) => {
  res.json({ items: await listUsers() })
})

adminRouter.post('/users', adminOnly, async (req, res) => {
  const input = createUserSchema.parse(req.body)
  res.status(201).json(await createUser(input, req.user!.id))
})

adminRouter.patch('/users/:id', adminOnly, async (req, res) => {
  const { id } = idParam.parse(req.params)
  const input = updateUserSchema.parse(req.body)
  res.json(await updateUser(id, input, req.user!.id))
})

adminRouter.get('/audit', adminOnly, async (req, res) => {
  const q = pagingQuerySchema
    .extend({ entityType: z.string().max(64).optional(), entityId: z.string().max(64).optional() })
    .parse(req.query)
  res.json(await listAudit(q))
})

adminRouter.get('/mail', adminOnly, async (_req, res) => {
  const dir = config().MAIL_CATCH_DIR
  if (config().NODE_ENV === 'production' || !dir) throw notFound('mail catcher')
  res.json({ items: await listCaughtMail(dir) })
})
