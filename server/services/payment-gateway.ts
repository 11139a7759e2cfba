import Stripe from 'stripe'
import { config } from '../config.ts'
import { AppError } from '../errors.ts'
import { ErrorCode } from '../../shared/errors.ts'

let cached: { key: string; port: number | undefined; client: Stripe } | undefined

/** True when online payment is configured (secret key and webhook secret). */
export function onlinePaymentConfigured(): boolean {
  const cfg = config()
  return Boolean(cfg.STRIPE_SECRET_KEY && cfg.STRIPE_WEBHOOK_SECRET)
}

/**
 * The payment SDK client of this process. Host, port and protocol come from the configuration,
 * so development and tests talk to the local fake payment server on loopback.
 */
export function paymentClient(): Stripe {
  const cfg = config()
  if (!cfg.STRIPE_SECRET_KEY || !cfg.STRIPE_WEBHOOK_SECRET) {
    throw new AppError(
      ErrorCode.SERVICE_UNAVAILABLE,
      503,
      'Online payment is not set up on this server; ask the permit office for an invoice',
    )
  }
  if (!cached || cached.key !== cfg.STRIPE_SECRET_KEY || cached.port !== cfg.STRIPE_API_PORT) {
    cached = {
      key: cfg.STRIPE_SECRET_KEY,
      port: cfg.STRIPE_API_PORT,
      client: new Stripe(cfg.STRIPE_SECRET_KEY, {
        ...(cfg.STRIPE_API_HOST ? { host: cfg.STRIPE_API_HOST } : {}),
        ...(cfg.STRIPE_API_PORT ? { port: cfg.STRIPE_API_PORT } : {}),
        ...(cfg.STRIPE_API_PROTOCOL ? { protocol: cfg.STRIPE_API_PROTOCOL } : {}),
        maxNetworkRetries: 2,
        timeout: 20_000,
        telemetry: false,
      }),
    }
  }
  return cached.client
}

/** The webhook secret (only called once online payment is configured). */
export function webhookSecret(): string {
  const s = config().STRIPE_WEBHOOK_SECRET
  if (!s)
    throw new AppError(
      ErrorCode.SERVICE_UNAVAILABLE,
      503,
      'Online payment is not set up on this server',
    )
  return s
}
