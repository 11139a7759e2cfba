import { Router } from 'express'
import { allow } from '../middleware/access.ts'
import { homeItemsFor } from '../services/home.ts'

export const homeRouter = Router()

homeRouter.get('/', allow('signed-in'), async (req, res) => {
  res.json({ role: req.user!.role, items: await homeItemsFor(req.user!) })
})
