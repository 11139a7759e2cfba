import express from 'express'
import type { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { allow } from '../middleware/access.ts'
import { handlePaymentWebhook } from '../services/payments.ts'

/**
 * POST /api/payments/webhook: events from the payment service. Mounted before express.json
 * and the session, client-header and CSRF guards, because the signature covers the raw body
 * bytes and the caller is the payment service, not a browser.
 */
export function paymentWebhookRouter(sequelize: Sequelize): Router {
  const router = express.Router()
  router.post(
    '/',
    allow('public'),
    express.raw({ type: '*/*', limit: '1mb' }),
    async (req, res) => {
      const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0)
      res.json(
        await handlePaymentWebhook(sequelize, body, req.get('stripe-signature') ?? undefined),
      )
    },
  )
  return router
}
