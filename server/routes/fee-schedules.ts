import { Router } from 'express'
import { feeScheduleInputSchema } from '../../shared/schemas/fees.ts'
import { allow } from '../middleware/access.ts'
import { createFeeSchedule, listFeeSchedules } from '../services/fee-schedules.ts'

/** /api/fee-schedules: the permit officer's authority's schedule versions. */
export const feeSchedulesRouter = Router()
const officers = allow(['permit_officer'])

feeSchedulesRouter.get('/', officers, async (req, res) => {
  res.json(await listFeeSchedules(req.user!))
})

feeSchedulesRouter.post('/', officers, async (req, res) => {
  res.status(201).json(await createFeeSchedule(req.user!, feeScheduleInputSchema.parse(req.body)))
})
