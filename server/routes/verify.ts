import { Router } from 'express'
import { verificationCodeParamSchema } from '../../shared/schemas/verification.ts'
import { config } from '../config.ts'
import { allow } from '../middleware/access.ts'
import { verifyLimiter } from '../middleware/rate-limits.ts'
import { receivePdf } from '../services/receive-pdf.ts'
import { checkDocument, verifyCode } from '../services/verification.ts'

/** /api/verify: the public permit check, no sign-in. */
export const verifyRouter = Router()

verifyRouter.get('/:code', allow('public'), verifyLimiter, async (req, res) => {
  const { code } = verificationCodeParamSchema.parse(req.params)
  res.setHeader('Cache-Control', 'no-store')
  res.json(await verifyCode(code))
})

verifyRouter.post('/:code/document', allow('public'), verifyLimiter, async (req, res) => {
  const { code } = verificationCodeParamSchema.parse(req.params)
  const file = await receivePdf(req, config().VERIFY_MAX_UPLOAD_MB * 1024 * 1024)
  res.setHeader('Cache-Control', 'no-store')
  res.json(await checkDocument(code, file))
})
