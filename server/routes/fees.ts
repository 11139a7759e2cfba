import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { z } from 'zod'
import { offlineMovementInputSchema, paymentTermsInputSchema } from '../../shared/schemas/fees.ts'
import { allow } from '../middleware/access.ts'
import { listApplicationFees, setPaymentTerms } from '../services/application-fees.ts'
import { recordOfflinePayment, recordOfflineRefund } from '../services/offline-payments.ts'
import { confirmCheckout, retryRefund, startCheckout } from '../services/payments.ts'
import { receiptDocument } from '../services/application-fees.ts'

const idParam = z.object({ id: z.coerce.number().int().positive() })

/** Fees of an application, paying them online, refunds and receipt PDFs. */
export function feesRouter(sequelize: Sequelize): Router {
  const router = Router()
  const payers = allow(['applicant', 'permit_officer', 'admin'])

  router.get('/applications/:id/fees', payers, async (req, res) => {
    res.json(await listApplicationFees(req.user!, idParam.parse(req.params).id))
  })

  router.put('/applications/:id/fees/terms', allow(['permit_officer']), async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(await setPaymentTerms(req.user!, id, paymentTermsInputSchema.parse(req.body)))
  })

  router.post('/fees/:id/checkout', allow(['applicant']), async (req, res) => {
    res.status(201).json(await startCheckout(req.user!, idParam.parse(req.params).id))
  })

  router.post('/fees/:id/confirm', allow(['applicant']), async (req, res) => {
    res.json(await confirmCheckout(sequelize, req.user!, idParam.parse(req.params).id))
  })

  router.post('/fees/:id/refund', allow(['permit_officer']), async (req, res) => {
    res.json(await retryRefund(sequelize, req.user!, idParam.parse(req.params).id))
  })

  router.post('/fees/:id/record-payment', allow(['permit_officer']), async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(
      await recordOfflinePayment(
        sequelize,
        req.user!,
        id,
        offlineMovementInputSchema.parse(req.body),
      ),
    )
  })

  router.post('/fees/:id/record-refund', allow(['permit_officer']), async (req, res) => {
    const { id } = idParam.parse(req.params)
    res.json(
      await recordOfflineRefund(
        sequelize,
        req.user!,
        id,
        offlineMovementInputSchema.parse(req.body),
      ),
    )
  })

  router.get('/receipts/:id/document', payers, async (req, res) => {
    const { path, filename } = await receiptDocument(req.user!, idParam.parse(req.params).id)
    res.setHeader('Content-Type', 'application/pdf')
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`)
    // The data folder may be a dot folder (.data); the path comes from our own row.
    res.sendFile(path, { dotfiles: 'allow' })
  })

  return router
}
