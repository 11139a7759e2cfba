import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { workingDaysBetween } from '../../shared/time/working-days.ts'
import type { AppConfig } from '../config.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { reviewReminderMail } from '../mail/templates/review-reminder.ts'
import { Application, Organisation, OwnerReview } from '../models/index.ts'
import { organisationEmails } from './mail-recipients.ts'
import { isoToday } from './review-clock.ts'

/**
 * Send the reminders that are due now: to the owner's engineers when an open, running review is
 * REMINDER_DAYS_BEFORE working days (or fewer) from its due date (`due_soon`), and on or after
 * the due date (`due_today`). Each reminder is claimed by inserting its row into
 * review_reminders in the same transaction as its mails; the unique keys (review + day,
 * review + kind + due date) make a second process, or a second run, skip it. So a review gets
 * at most one reminder a day and one of each kind per due date. Returns how many were sent.
 */
export async function runRemindersOnce(
  sequelize: Sequelize,
  cfg: AppConfig,
  now = new Date(),
): Promise<number> {
  const today = isoToday(now)
  const reviews = await OwnerReview.findAll({
    where: { state: 'waiting', pausedAt: null },
    include: [
      { model: Organisation, as: 'owner', attributes: ['id', 'name'] },
      // Only applications still with the owners: a withdrawn one needs no reminder.
      {
        model: Application,
        as: 'application',
        attributes: ['id'],
        where: { status: 'with_owners' },
        required: true,
      },
    ],
  })
  let sent = 0
  for (const r of reviews) {
    if (!r.dueOn) continue
    const dueIn = workingDaysBetween(today, r.dueOn, cfg.publicHolidays)
    const kind = dueIn <= 0 ? 'due_today' : dueIn <= cfg.REMINDER_DAYS_BEFORE ? 'due_soon' : null
    if (!kind) continue
    const claimed = await sequelize.transaction(async (transaction) => {
      const [, inserted] = await sequelize.query(
        `INSERT IGNORE INTO review_reminders (review_id, kind, due_on, sent_on, created_at)
         VALUES (?, ?, ?, ?, ?)`,
        { replacements: [r.id, kind, r.dueOn, today, now], type: QueryTypes.INSERT, transaction },
      )
      if (!inserted) return false
      const a = await Application.findByPk(r.applicationId, {
        attributes: ['id', 'reference', 'title'],
        transaction,
      })
      const mail = reviewReminderMail({
        publicUrl: cfg.publicUrl,
        reviewId: r.id,
        ownerName: r.owner?.name ?? 'network owner',
        reference: a?.reference ?? `#${r.applicationId}`,
        title: a?.title ?? '',
        dueOn: r.dueOn!,
        kind,
        dueInWorkingDays: dueIn,
      })
      for (const to of await organisationEmails(
        r.ownerOrganisationId,
        'asset_engineer',
        transaction,
      )) {
        await enqueueMail(
          { to: [to], ...mail, related: { type: 'owner_review', id: r.id } },
          transaction,
        )
      }
      return true
    })
    if (claimed) sent++
  }
  return sent
}
