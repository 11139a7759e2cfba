import { Router } from 'express'
import { z } from 'zod'
import {
  conditionTemplateInputSchema,
  conditionTemplateUpdateSchema,
} from '../../shared/schemas/condition-templates.ts'
import { allow } from '../middleware/access.ts'
import {
  createConditionTemplate,
  getConditionTemplate,
  listConditionTemplates,
  retireConditionTemplate,
  updateConditionTemplate,
} from '../services/condition-templates.ts'

const idParam = z.object({ id: z.coerce.number().int().positive() })

/** /api/condition-templates: the owner's library of standard conditions. */
export const conditionTemplatesRouter = Router()
const engineers = allow(['asset_engineer'])

conditionTemplatesRouter.get('/', engineers, async (req, res) => {
  const { includeInactive } = z
    .object({ includeInactive: z.enum(['true', 'false']).default('false') })
    .parse(req.query)
  res.json(await listConditionTemplates(req.user!, includeInactive === 'true'))
})

conditionTemplatesRouter.post('/', engineers, async (req, res) => {
  res
    .status(201)
    .json(await createConditionTemplate(req.user!, conditionTemplateInputSchema.parse(req.body)))
})

conditionTemplatesRouter.get('/:id', engineers, async (req, res) => {
  res.json(await getConditionTemplate(req.user!, idParam.parse(req.params).id))
})

conditionTemplatesRouter.put('/:id', engineers, async (req, res) => {
  const { id } = idParam.parse(req.params)
  res.json(
    await updateConditionTemplate(req.user!, id, conditionTemplateUpdateSchema.parse(req.body)),
  )
})

conditionTemplatesRouter.delete('/:id', engineers, async (req, res) => {
  await retireConditionTemplate(req.user!, idParam.parse(req.params).id)
  res.status(204).end()
})
