import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { addDays, format, nextFriday } from 'date-fns'
import { QueryTypes } from 'sequelize'
import { OutboxMail, OwnerReview, User } from '../../server/models/index.ts'
import { answerOwnerQuestion } from '../../server/services/application-reviews.ts'
import { submitApplication as submitService } from '../../server/services/applications.ts'
import { runRemindersOnce } from '../../server/services/review-reminders.ts'
import { decideReview } from '../../server/services/reviews.ts'
import { signedInAgent, startTestApp } from '../helpers/test-app.ts'
import type { TestApp } from '../helpers/test-app.ts'
import { buildTwoOwnerNetwork, permitDirs, worksNearBoth } from '../helpers/review-fixtures.ts'

// A Friday within the next week, and the Monday after it as a public holiday.
const friday = nextFriday(new Date())
const iso = (offset_days: number) => format(addDays(friday, offset_days), 'yyyy-MM-dd')
const at = (offset_days: number) => new Date(`${iso(offset_days)}T09:00:00`)
const HOLIDAY = iso(3)

let app: TestApp
beforeAll(async () => {
  app = await startTestApp({
    ...permitDirs(),
    PUBLIC_HOLIDAYS: HOLIDAY,
    REVIEW_PERIOD_WORKING_DAYS: '3',
    REMINDER_DAYS_BEFORE: '1',
  })
})
afterAll(async () => {
  await app.close()
})

/** Submit on the Friday through the service (the clock starts then). */
async function submittedOnFriday() {
  const net = await buildTwoOwnerNetwork(app)
  const applicant = await signedInAgent(app, 'applicant')
  const draft = await applicant.agent.post('/api/applications').send({
    title: 'Clock test',
    siteAddress: '3 Example Row',
    contactName: 'Sam Site',
    contactPhone: '+49 170 1234567',
    startsOn: iso(10),
    endsOn: iso(20),
    description: 'Works for the clock test.',
    activities: worksNearBoth(net.origin),
  })
  expect(draft.status).toBe(201)
  await submitService(app.sequelize, applicant.user, draft.body.id, 0, at(0))
  const review = (await OwnerReview.findOne({
    where: { applicationId: draft.body.id, ownerOrganisationId: net.water.id },
  }))!
  return { net, applicant, id: draft.body.id as number, review }
}

describe('review due dates in working days', () => {
  it('when a review opens on a Friday before a holiday Monday, then 3 working days end on Thursday', async () => {
    const { review } = await submittedOnFriday()
    // Fri opened; Sat, Sun weekend; Mon holiday; Tue 1, Wed 2, Thu 3.
    expect(review.openedOn).toBe(iso(0))
    expect(review.dueOn).toBe(iso(6))
  })

  it('when the engineer asks a question, then the clock pauses and resumes with the days left', async () => {
    const { net, applicant, id, review } = await submittedOnFriday()
    const engineer = (await User.findOne({ where: { email: net.w.email } }))!
    // Asked on Tuesday: Wed and Thu are left.
    await decideReview(
      app.sequelize,
      engineer,
      review.id,
      { decision: 'information_requested', version: 0, question: 'Which mats?' },
      at(4),
    )
    const paused = (await OwnerReview.findByPk(review.id))!
    expect(paused.state).toBe('information_requested')
    expect(paused.remainingWorkingDays).toBe(2)
    // Answered the next Wednesday: Thu 1, Fri 2.
    await answerOwnerQuestion(
      app.sequelize,
      applicant.user,
      id,
      review.id,
      { body: 'Timber, 1.5 m square.' },
      at(12),
    )
    const resumed = (await OwnerReview.findByPk(review.id))!
    expect(resumed).toMatchObject({ state: 'waiting', pausedAt: null, dueOn: iso(14) })
  })
})

describe('review reminders', () => {
  it('when the scheduler runs before and on the due date, also twice at once, then each reminder goes out once', async () => {
    const { net, review } = await submittedOnFriday()
    const sent = async () =>
      (
        await OutboxMail.findAll({
          where: {
            toAddress: net.w.email,
            relatedType: 'owner_review',
            relatedId: String(review.id),
          },
        })
      )
        .map((m) => m.subject)
        .filter((s) => s.startsWith('Reminder'))
    const rows = () =>
      app.sequelize.query<{ kind: string; sent_on: string }>(
        'SELECT kind, sent_on FROM review_reminders WHERE review_id = ? ORDER BY id',
        { replacements: [review.id], type: QueryTypes.SELECT },
      )
    // Tuesday: two working days before the due Thursday, more than REMINDER_DAYS_BEFORE = 1.
    await runRemindersOnce(app.sequelize, app.config, at(4))
    expect(await sent()).toEqual([])
    // Wednesday: one working day before; two processes at once, then once more.
    await Promise.all([
      runRemindersOnce(app.sequelize, app.config, at(5)),
      runRemindersOnce(app.sequelize, app.config, at(5)),
    ])
    await runRemindersOnce(app.sequelize, app.config, at(5))
    expect(await sent()).toEqual([
      `Reminder: your review of ${await reviewRef(review.applicationId)} is due on ${iso(6)}`,
    ])
    // Thursday, the due date: the due-day reminder, once.
    await Promise.all([
      runRemindersOnce(app.sequelize, app.config, at(6)),
      runRemindersOnce(app.sequelize, app.config, at(6)),
    ])
    // Friday: overdue, but the due-day reminder for this due date was sent already.
    await runRemindersOnce(app.sequelize, app.config, at(7))
    expect(await sent()).toHaveLength(2)
    expect((await rows()).map((r) => r.kind)).toEqual(['due_soon', 'due_today'])
  })
})

async function reviewRef(applicationId: number): Promise<string> {
  const [row] = await app.sequelize.query<{ reference: string }>(
    'SELECT reference FROM applications WHERE id = ?',
    {
      replacements: [applicationId],
      type: QueryTypes.SELECT,
    },
  )
  return row!.reference
}
