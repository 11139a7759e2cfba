import { readFileSync } from 'node:fs'
import { execFileSync } from 'node:child_process'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { signatureHeader } from '../../scripts/fake-payments.ts'
import type { FakePayments } from '../../scripts/fake-payments.ts'
import {
  ApplicationFee,
  FeeSchedule,
  OutboxMail,
  PaymentEvent,
  Receipt,
} from '../../server/models/index.ts'
import { nextReceiptSequence } from '../../server/services/receipts.ts'
import {
  pressOnPayPage,
  scheduleBody,
  startPaymentsTestApp,
  submitOneDayExcavation,
} from '../helpers/fee-fixtures.ts'
import {
  buildTwoOwnerNetwork,
  day,
  reviewIdFor,
  submitApplication,
  worksNearBoth,
} from '../helpers/review-fixtures.ts'
import { signedInAgent } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'

let app: TestApp
let fake: FakePayments
let officer: Awaited<ReturnType<typeof signedInAgent>>
let authorityId: number
let webhookSecret: string

// Prices of scheduleBody(): a short excavation costs EUR 100.00.
const SHORT_EXCAVATION_CENTS = 10_000

beforeAll(async () => {
  const started = await startPaymentsTestApp()
  ;({ app, fake, officer, authorityId } = started)
  webhookSecret = started.env.STRIPE_WEBHOOK_SECRET!
  const res = await officer.agent.post('/api/fee-schedules').send(scheduleBody(day(0)))
  expect(res.status).toBe(201)
})

afterAll(async () => {
  await app?.close()
  await fake?.close()
})

const feesOf = async (agent: ReturnType<TestApp['agent']>, id: number) => {
  const res = await agent.get(`/api/applications/${id}/fees`)
  expect(res.status).toBe(200)
  return res.body
}

describe('fee schedules', () => {
  it('when the officer adds a version starting later, then both are listed with their dates and today’s stays in force', async () => {
    const later = await officer.agent
      .post('/api/fee-schedules')
      .send(scheduleBody(day(30), { extensionFee_cents: 3_500 }))
    expect(later.status).toBe(201)
    expect(later.body).toMatchObject({
      effectiveFrom: day(30),
      effectiveTo: null,
      extensionFee_cents: 3_500,
    })
    const list = await officer.agent.get('/api/fee-schedules')
    expect(list.status).toBe(200)
    expect(list.body.versions.map((v: { effectiveFrom: string }) => v.effectiveFrom)).toEqual([
      day(30),
      day(0),
    ])
    expect(list.body.versions[1].effectiveTo).toBe(day(29))
    expect(list.body.inForceId).toBe(list.body.versions[1].id)
  })

  it('when a version would start in the past, lacks a price or repeats a first day, then it is refused naming the field', async () => {
    const past = await officer.agent.post('/api/fee-schedules').send(scheduleBody(day(-1)))
    expect(past.status).toBe(422)
    expect(past.body.error.fields).toEqual([
      { field: 'effectiveFrom', message: 'Must be today or later' },
    ])
    const body = scheduleBody(day(40))
    body.entries = body.entries.slice(1)
    const missing = await officer.agent.post('/api/fee-schedules').send(body)
    expect(missing.status).toBe(400)
    expect(missing.body.error.code).toBe('VALIDATION_FAILED')
    expect(missing.body.error.fields).toContainEqual({
      field: 'entries',
      message: 'Give a price for excavation in minor works',
    })
    const again = await officer.agent.post('/api/fee-schedules').send(scheduleBody(day(0)))
    expect(again.status).toBe(409)
  })

  it('when an applicant asks for the schedule, then it is forbidden', async () => {
    const a = await signedInAgent(app, 'applicant')
    expect((await a.agent.get('/api/fee-schedules')).status).toBe(403)
  })
})

describe('fee on submit and online payment against the fake payment server', () => {
  it('when the applicant pays, then the webhook books it, a numbered receipt is mailed and the permit can be granted; a replay changes nothing', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitOneDayExcavation(app, applicant.agent)
    let fees = await feesOf(applicant.agent, id)
    expect(fees.fees).toHaveLength(1)
    const fee = fees.fees[0]
    expect(fee).toMatchObject({
      purpose: 'application',
      state: 'due',
      amount_cents: SHORT_EXCAVATION_CENTS,
      currency: 'EUR',
      durationClass: 'minor',
      workingDays: 1,
      paymentTerms: 'invoice',
      refundRule: { beforeReview_percent: 100, afterReview_percent: 50 },
    })
    expect(fees.onlinePayment).toBe(true)

    // The office wants the money first; granting now is blocked.
    const terms = await officer.agent
      .put(`/api/applications/${id}/fees/terms`)
      .send({ paymentTerms: 'pay_before_grant' })
    expect(terms.status).toBe(200)
    expect(terms.body.grantBlocked).toBe(true)
    const app0 = await officer.agent.get(`/api/applications/${id}`)
    const blocked = await officer.agent
      .post(`/api/permit-office/applications/${id}/grant`)
      .send({ version: app0.body.version })
    expect(blocked.status).toBe(422)
    expect(blocked.body.error.message).toMatch(/paid before the permit is granted/)

    const checkout = await applicant.agent.post(`/api/fees/${fee.id}/checkout`).send({})
    expect(checkout.status).toBe(201)
    expect(checkout.body.url).toMatch(new RegExp(`^${fake.baseUrl}/pay/cs_`))
    const session = [...fake.sessions.values()].at(-1)!
    expect(session.amount_total).toBe(SHORT_EXCAVATION_CENTS)
    expect(session.currency).toBe('eur')
    expect(session.metadata.applicationFeeId).toBe(String(fee.id))

    const done = await pressOnPayPage(checkout.body.url, 'complete')
    expect(done.status).toBe(303)
    expect(done.headers.get('location')).toBe(
      `${app.config.publicUrl}/applications/${id}?payment=returned&fee=${fee.id}`,
    )
    const delivered = fake.deliveries.at(-1)!
    expect(delivered).toMatchObject({ type: 'checkout.session.completed', status: 200 })

    fees = await feesOf(applicant.agent, id)
    expect(fees.grantBlocked).toBe(false)
    expect(fees.fees[0]).toMatchObject({ state: 'paid', refunded_cents: 0 })
    expect(fees.fees[0].receipts).toHaveLength(1)
    const receipt = fees.fees[0].receipts[0]
    expect(receipt).toMatchObject({
      kind: 'payment',
      amount_cents: SHORT_EXCAVATION_CENTS,
      currency: 'EUR',
    })
    expect(receipt.number).toMatch(new RegExp(`^TWR-${new Date().getUTCFullYear()}-\\d{6}$`))

    const pdf = await applicant.agent.get(receipt.documentUrl).buffer(true)
    expect(pdf.status).toBe(200)
    expect(pdf.headers['content-type']).toBe('application/pdf')
    expect(pdf.body.subarray(0, 5).toString()).toBe('%PDF-')
    const mail = await OutboxMail.findOne({
      where: { toAddress: applicant.email, relatedType: 'receipt' },
    })
    expect(mail?.subject).toBe(
      `Receipt ${receipt.number}: EUR 100.00 received (${app0.body.reference})`,
    )

    // The payment service sends the same event again: acknowledged, nothing booked twice.
    const eventId = fake.events.find(
      (e) =>
        e.type === 'checkout.session.completed' &&
        (e.data.object as { id: string }).id === session.id,
    )!.id
    expect(await fake.redeliver(eventId)).toBe(200)
    expect(await PaymentEvent.count({ where: { eventId } })).toBe(1)
    expect(await Receipt.count({ where: { applicationFeeId: fee.id } })).toBe(1)

    // Coming back to the page asks the payment service too; still one receipt.
    const confirm = await applicant.agent.post(`/api/fees/${fee.id}/confirm`).send({})
    expect(confirm.status).toBe(200)
    expect(confirm.body.fees[0].receipts).toHaveLength(1)

    const app1 = await officer.agent.get(`/api/applications/${id}`)
    const granted = await officer.agent
      .post(`/api/permit-office/applications/${id}/grant`)
      .send({ version: app1.body.version })
    expect(granted.status).toBe(201)
  })

  it('when the payment fails, then the fee stays to pay, the failure shows and a new attempt can start', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitOneDayExcavation(app, applicant.agent)
    await officer.agent
      .put(`/api/applications/${id}/fees/terms`)
      .send({ paymentTerms: 'pay_before_grant' })
    const feeId = (await feesOf(applicant.agent, id)).fees[0].id
    const checkout = await applicant.agent.post(`/api/fees/${feeId}/checkout`).send({})
    const failed = await pressOnPayPage(checkout.body.url, 'fail')
    expect(failed.status).toBe(303)
    expect(failed.headers.get('location')).toBe(
      `${app.config.publicUrl}/applications/${id}?payment=cancelled&fee=${feeId}`,
    )
    expect(fake.deliveries.at(-1)).toMatchObject({ type: 'checkout.session.expired', status: 200 })
    const fees = await feesOf(applicant.agent, id)
    expect(fees.fees[0]).toMatchObject({ state: 'due', lastAttemptFailed: true, receipts: [] })
    expect(fees.grantBlocked).toBe(true)
    const again = await applicant.agent.post(`/api/fees/${feeId}/checkout`).send({})
    expect(again.status).toBe(201)
    expect((await feesOf(applicant.agent, id)).fees[0].lastAttemptFailed).toBe(false)
  })

  it('when another applicant tries to pay the fee, then it does not exist for them', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitOneDayExcavation(app, applicant.agent)
    const feeId = (await feesOf(applicant.agent, id)).fees[0].id
    const other = await signedInAgent(app, 'applicant')
    expect((await other.agent.post(`/api/fees/${feeId}/checkout`).send({})).status).toBe(404)
    expect((await other.agent.get(`/api/applications/${id}/fees`)).status).toBe(404)
  })
})

describe('POST /api/payments/webhook', () => {
  const event = JSON.stringify({
    id: 'evt_forged_1',
    object: 'event',
    type: 'checkout.session.completed',
    data: { object: { id: 'cs_x', metadata: {} } },
  })

  it('when the signature was made with another secret, then it responds 400 and books nothing', async () => {
    const res = await app
      .agent()
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signatureHeader(event, 'whsec_not_the_right_secret'))
      .send(event)
    expect(res.status).toBe(400)
    expect(res.body.error).toMatchObject({
      code: 'VALIDATION_FAILED',
      message: 'The webhook signature is missing or does not match',
    })
    expect(await PaymentEvent.count({ where: { eventId: 'evt_forged_1' } })).toBe(0)
  })

  it('when the body was changed after signing or the header is missing, then it responds 400', async () => {
    const header = signatureHeader(event, webhookSecret)
    const changed = await app
      .agent()
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', header)
      .send(event.replace('cs_x', 'cs_y'))
    expect(changed.status).toBe(400)
    const none = await app
      .agent()
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .send(event)
    expect(none.status).toBe(400)
  })

  it('when a correctly signed event of a kind we do not use arrives twice, then it is acknowledged once and then as a duplicate', async () => {
    const e = JSON.stringify({
      id: `evt_other_${Date.now()}`,
      object: 'event',
      type: 'customer.created',
      data: { object: { id: 'cus_1' } },
    })
    const send = () =>
      app
        .agent()
        .post('/api/payments/webhook')
        .set('Content-Type', 'application/json')
        .set('Stripe-Signature', signatureHeader(e, webhookSecret))
        .send(e)
    expect((await send()).body).toEqual({ received: true, duplicate: false, outcome: 'ignored' })
    expect((await send()).body).toEqual({ received: true, duplicate: true, outcome: 'ignored' })
  })
})

describe('receipt numbering', () => {
  it('when numbers are taken at the same time and one booking rolls back, then the committed numbers run on without a gap', async () => {
    const year = 2090 + Math.floor(Math.random() * 9) // a year of its own for this run
    await app.sequelize.query('DELETE FROM receipt_counters WHERE year = ?', {
      replacements: [year],
    })
    const taken = await Promise.all(
      Array.from({ length: 5 }, () =>
        app.sequelize.transaction((t) => nextReceiptSequence(year, t)),
      ),
    )
    expect([...taken].sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5])
    await expect(
      app.sequelize.transaction(async (t) => {
        await nextReceiptSequence(year, t)
        throw new Error('booking failed')
      }),
    ).rejects.toThrow('booking failed')
    expect(await app.sequelize.transaction((t) => nextReceiptSequence(year, t))).toBe(6)
  })
})

describe('refunds', () => {
  it('when a paid application is withdrawn before any owner answered, then the whole fee is paid back through the payment service with a refund note', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitOneDayExcavation(app, applicant.agent)
    const feeId = (await feesOf(applicant.agent, id)).fees[0].id
    const checkout = await applicant.agent.post(`/api/fees/${feeId}/checkout`).send({})
    await pressOnPayPage(checkout.body.url, 'complete')
    const withdrawn = await applicant.agent
      .post(`/api/applications/${id}/withdraw`)
      .send({ reason: 'Plans changed' })
    expect(withdrawn.status).toBe(200)
    const fees = await feesOf(applicant.agent, id)
    expect(fees.fees[0]).toMatchObject({
      state: 'refunded',
      refunded_cents: SHORT_EXCAVATION_CENTS,
      refundDue_cents: 0,
    })
    expect(
      fees.fees[0].receipts.map((r: { kind: string; amount_cents: number }) => [
        r.kind,
        r.amount_cents,
      ]),
    ).toEqual([
      ['payment', SHORT_EXCAVATION_CENTS],
      ['refund', SHORT_EXCAVATION_CENTS],
    ])
    const fee = await ApplicationFee.findByPk(feeId)
    expect(fake.refunds.get(fee!.refundId!)).toMatchObject({
      amount: SHORT_EXCAVATION_CENTS,
      payment_intent: fee!.paymentIntentId,
    })
  })

  it('when an owner has answered and the office refuses, then half the fee is paid back (the schedule’s after-review share)', async () => {
    const net = await buildTwoOwnerNetwork(app)
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitApplication(
      applicant.agent,
      worksNearBoth(net.origin),
      'Refund after review',
    )
    const fee = (await feesOf(applicant.agent, id)).fees[0]
    expect(fee.amount_cents).toBeGreaterThan(0)
    const checkout = await applicant.agent.post(`/api/fees/${fee.id}/checkout`).send({})
    await pressOnPayPage(checkout.body.url, 'complete')
    const reviewId = await reviewIdFor(net.w.agent, id)
    expect(
      (
        await net.w.agent
          .post(`/api/reviews/${reviewId}/decision`)
          .send({ decision: 'accepted', version: 0 })
      ).status,
    ).toBe(200)
    const a = await officer.agent.get(`/api/applications/${id}`)
    const refused = await officer.agent
      .post(`/api/permit-office/applications/${id}/refuse`)
      .send({ version: a.body.version, reasons: 'The street is closed for other works.' })
    expect(refused.status).toBe(200)
    const after = (await feesOf(applicant.agent, id)).fees[0]
    expect(after).toMatchObject({
      state: 'refunded',
      refunded_cents: Math.floor(fee.amount_cents / 2),
    })
  })

  it('when an unpaid application is withdrawn, then its fee is cancelled and nothing is refunded', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitOneDayExcavation(app, applicant.agent)
    await applicant.agent.post(`/api/applications/${id}/withdraw`).send({})
    expect((await feesOf(applicant.agent, id)).fees[0]).toMatchObject({
      state: 'cancelled',
      refunded_cents: 0,
      receipts: [],
    })
  })
})

describe('fees paid on invoice', () => {
  it('when the office books a transfer and the application is later withdrawn, then the receipt, the owed refund and the refund note follow', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitOneDayExcavation(app, applicant.agent)
    const feeId = (await feesOf(applicant.agent, id)).fees[0].id
    const empty = await officer.agent
      .post(`/api/fees/${feeId}/record-payment`)
      .send({ reference: ' ' })
    expect(empty.status).toBe(400)
    expect(empty.body.error.fields).toEqual([
      { field: 'reference', message: 'Give the bank transfer or invoice reference' },
    ])
    const booked = await officer.agent
      .post(`/api/fees/${feeId}/record-payment`)
      .send({ reference: 'BANK-2026-0042' })
    expect(booked.status).toBe(200)
    expect(booked.body.fees[0]).toMatchObject({
      state: 'paid',
      paidOnline: false,
      offlineReference: 'BANK-2026-0042',
    })
    expect(booked.body.fees[0].receipts.map((r: { kind: string }) => r.kind)).toEqual(['payment'])
    expect(
      (await applicant.agent.post(`/api/fees/${feeId}/record-payment`).send({ reference: 'x-1-2' }))
        .status,
    ).toBe(403)

    await applicant.agent.post(`/api/applications/${id}/withdraw`).send({})
    const owed = (await feesOf(applicant.agent, id)).fees[0]
    expect(owed).toMatchObject({ state: 'refund_due', refundDue_cents: SHORT_EXCAVATION_CENTS })
    // Not through the payment service: the office pays it back and books it.
    expect((await officer.agent.post(`/api/fees/${feeId}/refund`).send({})).status).toBe(422)
    const refunded = await officer.agent
      .post(`/api/fees/${feeId}/record-refund`)
      .send({ reference: 'BANK-2026-0077' })
    expect(refunded.status).toBe(200)
    expect(refunded.body.fees[0]).toMatchObject({
      state: 'refunded',
      refunded_cents: SHORT_EXCAVATION_CENTS,
    })
    expect(refunded.body.fees[0].receipts.map((r: { kind: string }) => r.kind)).toEqual([
      'payment',
      'refund',
    ])
  })
})

describe('fees on permit changes', () => {
  it('when the office extends and then varies a granted permit, then the schedule’s extension and variation fees are charged', async () => {
    const applicant = await signedInAgent(app, 'applicant')
    const id = await submitOneDayExcavation(app, applicant.agent)
    const a = await officer.agent.get(`/api/applications/${id}`)
    const granted = await officer.agent
      .post(`/api/permit-office/applications/${id}/grant`)
      .send({ version: a.body.version })
    expect(granted.status).toBe(201)
    const extended = await officer.agent
      .post(`/api/permits/${granted.body.id}/extend`)
      .send({ validTo: day(9), reason: 'Rain delayed the works' })
    expect(extended.status).toBe(201)
    const varied = await officer.agent.post(`/api/permits/${extended.body.id}/vary`).send({
      reason: 'Add a banksman',
      conditions: [{ code: 'OFFICE-1', text: 'A banksman guides every lorry.' }],
    })
    expect(varied.status).toBe(201)
    const fees = (await feesOf(applicant.agent, id)).fees
    expect(
      fees.map((f: { purpose: string; amount_cents: number; state: string }) => [
        f.purpose,
        f.amount_cents,
        f.state,
      ]),
    ).toEqual([
      ['application', SHORT_EXCAVATION_CENTS, 'due'],
      ['extension', 3_000, 'due'],
      ['variation', 4_500, 'due'],
    ])
    const ext = await ApplicationFee.findByPk(fees[1].id)
    const schedule = await FeeSchedule.findByPk(ext!.feeScheduleId)
    expect(schedule!.authorityOrganisationId).toBe(authorityId)
    expect(ext!.permitId).toBe(extended.body.id)
  })
})

describe('receipt PDF', () => {
  it('renders as a readable page', async () => {
    const r = await Receipt.findOne({ where: { kind: 'payment' }, order: [['id', 'DESC']] })
    const text = execFileSync('pdftotext', ['-layout', r!.pdfPath!, '-']).toString()
    expect(text).toContain(`No. ${r!.number}`)
    expect(text).toContain('Amount received')
    expect(readFileSync(r!.pdfPath!).subarray(0, 5).toString()).toBe('%PDF-')
  })
})
