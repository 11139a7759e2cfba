/**
 * Local fake payment server for development and tests. It stands in for the real payment
 * service on loopback so that nothing leaves the machine, and implements only the API calls
 * Trenchward makes through the `stripe` SDK:
 *   POST /v1/checkout/sessions          create a checkout session (hosted payment page)
 *   GET  /v1/checkout/sessions/:id      retrieve it
 *   POST /v1/refunds                    refund (part of) a completed payment
 * plus a plain hosted page at /pay/:session where a developer completes or fails the payment.
 * Completing or failing sends a webhook event to the configured URL, signed the way the real
 * service signs them: header `Stripe-Signature: t=<unix time>,v1=<hex HMAC-SHA256 of
 * "<t>.<raw body>" keyed with the webhook secret>`. No card data is asked for or kept.
 *
 * Usage: node --import tsx scripts/fake-payments.ts <port> <webhook-url>
 *   with STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET in the environment (scripts/start sets them).
 * Tests import startFakePayments() and run it in-process on a free port.
 */
import { createHmac, randomBytes } from 'node:crypto'
import { createServer } from 'node:http'
import type { IncomingMessage, ServerResponse } from 'node:http'
import type { AddressInfo } from 'node:net'
import { pathToFileURL } from 'node:url'

export interface FakeCheckoutSession {
  id: string
  object: 'checkout.session'
  mode: string
  status: 'open' | 'complete' | 'expired'
  payment_status: 'unpaid' | 'paid'
  amount_total: number
  currency: string
  url: string | null
  success_url: string
  cancel_url: string | null
  client_reference_id: string | null
  customer_email: string | null
  metadata: Record<string, string>
  payment_intent: string | null
  line_items_summary: { name: string; amount: number; quantity: number }[]
  created: number
  livemode: false
}

export interface FakeEvent {
  id: string
  object: 'event'
  api_version: string
  created: number
  type: string
  data: { object: unknown }
  livemode: false
  pending_webhooks: number
  request: { id: null; idempotency_key: null }
}

export interface FakeDelivery {
  eventId: string
  type: string
  status: number | 'failed'
}

export interface FakePayments {
  port: number
  baseUrl: string
  setWebhookUrl(url: string): void
  sessions: Map<string, FakeCheckoutSession>
  refunds: Map<string, { id: string; amount: number; payment_intent: string }>
  events: FakeEvent[]
  deliveries: FakeDelivery[]
  /** Send an event again exactly as before (same id, new signature time), as the real service retries. */
  redeliver(eventId: string): Promise<number | 'failed'>
  close(): Promise<void>
}

/** The signature header value for a payload, as the real service computes it. */
export function signatureHeader(
  payload: string,
  secret: string,
  timestamp_s = Math.floor(Date.now() / 1000),
): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp_s}.${payload}`, 'utf8').digest('hex')
  return `t=${timestamp_s},v1=${v1}`
}

const newId = (prefix: string) => `${prefix}_fake_${randomBytes(12).toString('hex')}`

/** Form-encoded bodies with bracket keys (`line_items[0][price_data][currency]`) to nested objects. */
function parseForm(body: string): Record<string, unknown> {
  const out: Record<string, unknown> = {}
  for (const [rawKey, value] of new URLSearchParams(body)) {
    const parts = rawKey.split(/\[|\]\[|\]/).filter((p) => p !== '')
    let node: Record<string, unknown> = out
    parts.forEach((p, i) => {
      if (i === parts.length - 1) node[p] = value
      else node = (node[p] ??= {}) as Record<string, unknown>
    })
  }
  return out
}

const readBody = (req: IncomingMessage) =>
  new Promise<string>((resolve, reject) => {
    let s = ''
    req.setEncoding('utf8')
    req.on('data', (c: string) => {
      s += c
      if (s.length > 1_000_000) reject(new Error('body too large'))
    })
    req.on('end', () => resolve(s))
    req.on('error', reject)
  })

function json(res: ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { 'Content-Type': 'application/json' })
  res.end(JSON.stringify(body))
}

const apiError = (res: ServerResponse, status: number, message: string, param?: string) =>
  json(res, status, {
    error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) },
  })

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)

function payPage(s: FakeCheckoutSession): string {
  const money = (n: number) => `${s.currency.toUpperCase()} ${(n / 100).toFixed(2)}`
  const rows = s.line_items_summary
    .map(
      (l) =>
        `<tr><td>${esc(l.name)}</td><td>${l.quantity}</td><td style="text-align:right">${money(l.amount * l.quantity)}</td></tr>`,
    )
    .join('')
  const open = s.status === 'open'
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Local test payment</title>
<style>body{font-family:sans-serif;max-width:34rem;margin:2rem auto;padding:0 1rem;color:#222}
.banner{background:#fff4d6;border:1px solid #d9b54a;padding:.6rem .8rem;border-radius:6px}
table{width:100%;border-collapse:collapse;margin:1rem 0}td,th{padding:.4rem;border-bottom:1px solid #ddd;text-align:left}
button{font-size:1rem;padding:.6rem 1.2rem;margin-right:.6rem;border-radius:6px;border:1px solid #555;cursor:pointer}
.pay{background:#1f6f50;color:#fff;border-color:#1f6f50}</style></head><body>
<p class="banner"><strong>Local test payment page.</strong> This page stands in for the payment service on this computer only: no money moves and no card details are asked for.</p>
<h1>Pay ${money(s.amount_total)}</h1>
<table><thead><tr><th>Item</th><th>Qty</th><th style="text-align:right">Amount</th></tr></thead><tbody>${rows}</tbody></table>
${
  open
    ? `<form method="post" action="/pay/${s.id}/complete" style="display:inline"><button class="pay" type="submit">Complete the payment</button></form>
<form method="post" action="/pay/${s.id}/fail" style="display:inline"><button type="submit">Let the payment fail</button></form>`
    : `<p>This payment is ${s.status === 'complete' ? 'complete' : 'no longer open'}.</p>`
}
</body></html>`
}

/** Start the fake on 127.0.0.1 (port 0: any free port). */
export async function startFakePayments(opts: {
  port?: number
  secretKey: string
  webhookSecret: string
  webhookUrl?: string
}): Promise<FakePayments> {
  const sessions = new Map<string, FakeCheckoutSession>()
  const refunds = new Map<
    string,
    { id: string; amount: number; payment_intent: string; currency: string }
  >()
  const paymentIntents = new Map<string, { amount: number; refunded: number; currency: string }>()
  const idempotent = new Map<string, { status: number; body: unknown }>()
  const events: FakeEvent[] = []
  const deliveries: FakeDelivery[] = []
  let webhookUrl = opts.webhookUrl
  let baseUrl = ''

  async function deliver(event: FakeEvent): Promise<number | 'failed'> {
    if (!webhookUrl) return 'failed'
    const payload = JSON.stringify(event, null, 2)
    let status: number | 'failed'
    try {
      const r = await fetch(webhookUrl, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json',
          'Stripe-Signature': signatureHeader(payload, opts.webhookSecret),
        },
        body: payload,
      })
      status = r.status
    } catch {
      status = 'failed'
    }
    deliveries.push({ eventId: event.id, type: event.type, status })
    return status
  }

  function emit(type: string, object: unknown): Promise<number | 'failed'> {
    const event: FakeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: '2026-01-01.fake',
      created: Math.floor(Date.now() / 1000),
      type,
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
    }
    events.push(event)
    return deliver(event)
  }

  function createSession(p: Record<string, unknown>, res: ServerResponse): void {
    if (p.mode !== 'payment')
      return apiError(res, 400, 'Only mode=payment is supported here', 'mode')
    if (typeof p.success_url !== 'string')
      return apiError(res, 400, 'Missing success_url', 'success_url')
    const items = Object.values((p.line_items ?? {}) as Record<string, Record<string, unknown>>)
    if (!items.length) return apiError(res, 400, 'Missing line_items', 'line_items')
    const summary: FakeCheckoutSession['line_items_summary'] = []
    let currency = ''
    for (const it of items) {
      const pd = (it.price_data ?? {}) as Record<string, unknown>
      const amount = Number(pd.unit_amount)
      const quantity = Number(it.quantity ?? 1)
      if (!Number.isInteger(amount) || amount < 0)
        return apiError(res, 400, 'Invalid unit_amount', 'line_items')
      if (!Number.isInteger(quantity) || quantity < 1)
        return apiError(res, 400, 'Invalid quantity', 'line_items')
      const c = String(pd.currency ?? '').toLowerCase()
      if (!/^[a-z]{3}$/.test(c) || (currency && c !== currency))
        return apiError(res, 400, 'Invalid currency', 'currency')
      currency = c
      const name = String(((pd.product_data ?? {}) as Record<string, unknown>).name ?? 'Item')
      summary.push({ name, amount, quantity })
    }
    const id = newId('cs')
    const s: FakeCheckoutSession = {
      id,
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: summary.reduce((n, l) => n + l.amount * l.quantity, 0),
      currency,
      url: `${baseUrl}/pay/${id}`,
      success_url: p.success_url,
      cancel_url: typeof p.cancel_url === 'string' ? p.cancel_url : null,
      client_reference_id: typeof p.client_reference_id === 'string' ? p.client_reference_id : null,
      customer_email: typeof p.customer_email === 'string' ? p.customer_email : null,
      metadata: (p.metadata ?? {}) as Record<string, string>,
      payment_intent: null,
      line_items_summary: summary,
      created: Math.floor(Date.now() / 1000),
      livemode: false,
    }
    sessions.set(id, s)
    json(res, 200, s)
  }

  function createRefund(p: Record<string, unknown>, res: ServerResponse): void {
    const piId = String(p.payment_intent ?? '')
    const pi = paymentIntents.get(piId)
    if (!pi) return apiError(res, 404, `No such payment_intent: '${piId}'`, 'payment_intent')
    const amount = p.amount === undefined ? pi.amount - pi.refunded : Number(p.amount)
    if (!Number.isInteger(amount) || amount < 1)
      return apiError(res, 400, 'Invalid amount', 'amount')
    if (amount > pi.amount - pi.refunded)
      return apiError(res, 400, 'Refund amount is greater than the unrefunded amount', 'amount')
    pi.refunded += amount
    const r = {
      id: newId('re'),
      object: 'refund',
      amount,
      currency: pi.currency,
      payment_intent: piId,
      status: 'succeeded',
      metadata: p.metadata ?? {},
    }
    refunds.set(r.id, r)
    json(res, 200, r)
    void emit('refund.created', r)
  }

  async function finish(
    id: string,
    outcome: 'complete' | 'fail',
    res: ServerResponse,
  ): Promise<void> {
    const s = sessions.get(id)
    if (!s) return apiError(res, 404, 'No such checkout session')
    if (s.status !== 'open') {
      res.writeHead(303, { Location: `/pay/${id}` })
      return void res.end()
    }
    if (outcome === 'complete') {
      s.status = 'complete'
      s.payment_status = 'paid'
      s.payment_intent = newId('pi')
      s.url = null
      paymentIntents.set(s.payment_intent, {
        amount: s.amount_total,
        refunded: 0,
        currency: s.currency,
      })
      await emit('checkout.session.completed', s)
      res.writeHead(303, { Location: s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id) })
    } else {
      s.status = 'expired'
      s.url = null
      await emit('checkout.session.expired', s)
      res.writeHead(303, {
        Location: (s.cancel_url ?? s.success_url).replace('{CHECKOUT_SESSION_ID}', s.id),
      })
    }
    res.end()
  }

  const server = createServer((req, res) => {
    void (async () => {
      const url = new URL(req.url ?? '/', 'http://127.0.0.1')
      const path = url.pathname
      if (path.startsWith('/v1/')) {
        if (req.headers.authorization !== `Bearer ${opts.secretKey}`) {
          return json(res, 401, {
            error: { type: 'invalid_request_error', message: 'Invalid API Key provided' },
          })
        }
        const body = req.method === 'POST' ? parseForm(await readBody(req)) : {}
        const key = req.headers['idempotency-key']
        const idemKey = typeof key === 'string' && req.method === 'POST' ? `${path} ${key}` : null
        if (idemKey && idempotent.has(idemKey)) {
          const prev = idempotent.get(idemKey)!
          return json(res, prev.status, prev.body)
        }
        const capture = idemKey
          ? () => {
              const end = res.end.bind(res)
              const chunks: string[] = []
              res.end = ((chunk?: unknown) => {
                if (typeof chunk === 'string') chunks.push(chunk)
                idempotent.set(idemKey, {
                  status: res.statusCode,
                  body: JSON.parse(chunks.join('') || 'null'),
                })
                return end(chunk as string)
              }) as typeof res.end
            }
          : () => {}
        capture()
        if (req.method === 'POST' && path === '/v1/checkout/sessions')
          return createSession(body, res)
        const m = /^\/v1\/checkout\/sessions\/([^/]+)$/.exec(path)
        if (req.method === 'GET' && m) {
          const s = sessions.get(decodeURIComponent(m[1]!))
          return s ? json(res, 200, s) : apiError(res, 404, `No such checkout.session: '${m[1]}'`)
        }
        if (req.method === 'POST' && path === '/v1/refunds') return createRefund(body, res)
        return apiError(
          res,
          404,
          `The fake payment server does not implement ${req.method} ${path}`,
        )
      }
      const pay = /^\/pay\/([^/]+)(?:\/(complete|fail))?$/.exec(path)
      if (pay) {
        const id = decodeURIComponent(pay[1]!)
        if (req.method === 'POST' && pay[2])
          return finish(id, pay[2] === 'complete' ? 'complete' : 'fail', res)
        const s = sessions.get(id)
        if (!s) return apiError(res, 404, 'No such checkout session')
        res.writeHead(200, { 'Content-Type': 'text/html; charset=utf-8' })
        return void res.end(payPage(s))
      }
      apiError(res, 404, 'Not found')
    })().catch((err: Error) => {
      if (!res.headersSent) apiError(res, 500, err.message)
    })
  })
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject)
    server.listen(opts.port ?? 0, '127.0.0.1', () => resolve())
  })
  const port = (server.address() as AddressInfo).port
  baseUrl = `http://127.0.0.1:${port}`
  return {
    port,
    baseUrl,
    setWebhookUrl: (u) => {
      webhookUrl = u
    },
    sessions,
    refunds,
    events,
    deliveries,
    redeliver(eventId) {
      const e = events.find((x) => x.id === eventId)
      if (!e) throw new RangeError(`no event ${eventId}`)
      return deliver(e)
    },
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections()
        server.close(() => resolve())
      }),
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const port = Number(process.argv[2] ?? 3515)
  const webhookUrl = process.argv[3]
  const secretKey = process.env.STRIPE_SECRET_KEY
  const webhookSecret = process.env.STRIPE_WEBHOOK_SECRET
  if (!webhookUrl || !secretKey || !webhookSecret) {
    console.error(
      'usage: STRIPE_SECRET_KEY=… STRIPE_WEBHOOK_SECRET=… fake-payments.ts <port> <webhook-url>',
    )
    process.exit(2)
  }
  const fake = await startFakePayments({ port, secretKey, webhookSecret, webhookUrl })
  console.error(
    `[fake-payments] payment API and pay page on ${fake.baseUrl}; webhooks to ${webhookUrl}`,
  )
  const stop = () => void fake.close().then(() => process.exit(0))
  process.on('SIGINT', stop)
  process.on('SIGTERM', stop)
}
