import type { Transaction } from 'sequelize'
import type { Verdict } from '../../shared/statics/types.ts'
import type { ApplicationStatus } from '../../shared/types/application.ts'
import { VERDICT_RANK } from '../../shared/types/screening.ts'
import { config } from '../config.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { reviewOpenedMail } from '../mail/templates/review-opened.ts'
import { Application, Assessment, Organisation, OwnerReview } from '../models/index.ts'
import { recordAudit } from './audit.ts'
import { organisationEmails } from './mail-recipients.ts'
import { isoToday, reviewDueOn } from './review-clock.ts'

/**
 * Open the owner reviews of a just-screened application, inside the submit transaction: one
 * `waiting` review per owner with an affected segment, due the configured number of working
 * days after today, mailed to that owner's engineers; a `not_affected` record for every other
 * network owner. Moves the application to `with_owners`, or straight to `ready_for_decision`
 * when no owner is affected. Returns the new status.
 */
export async function openOwnerReviews(
  application: Application,
  actorUserId: number,
  transaction: Transaction,
  now = new Date(),
): Promise<ApplicationStatus> {
  const cfg = config()
  const today = isoToday(now)
  const dueOn = reviewDueOn(today, cfg.REVIEW_PERIOD_WORKING_DAYS, cfg.publicHolidays)
  const assessments = await Assessment.findAll({
    where: { applicationId: application.id },
    attributes: ['ownerOrganisationId', 'verdict'],
    transaction,
  })
  const affected = new Map<number, { count: number; worst: Verdict }>()
  for (const a of assessments) {
    const prev = affected.get(a.ownerOrganisationId)
    if (!prev) affected.set(a.ownerOrganisationId, { count: 1, worst: a.verdict })
    else {
      prev.count++
      if (VERDICT_RANK[a.verdict] > VERDICT_RANK[prev.worst]) prev.worst = a.verdict
    }
  }
  const owners = await Organisation.findAll({
    where: { kind: 'network_owner' },
    attributes: ['id', 'name'],
    transaction,
  })
  const ownerIds = new Set(owners.map((o) => o.id))
  // An assessment of an organisation no longer marked as an owner still gets its review.
  for (const id of affected.keys()) if (!ownerIds.has(id)) ownerIds.add(id)
  const names = new Map(owners.map((o) => [o.id, o.name]))

  await OwnerReview.bulkCreate(
    [...ownerIds].map((ownerOrganisationId) => {
      const hit = affected.get(ownerOrganisationId)
      return {
        applicationId: application.id,
        ownerOrganisationId,
        state: hit ? ('waiting' as const) : ('not_affected' as const),
        affectedSegmentCount: hit?.count ?? 0,
        worstVerdict: hit?.worst ?? null,
        openedOn: today,
        dueOn: hit ? dueOn : null,
        pausedAt: null,
        remainingWorkingDays: null,
        decidedByUserId: null,
        decidedAt: hit ? null : now,
        reasons: null,
        conditions: null,
      }
    }),
    { transaction },
  )

  const opened = await OwnerReview.findAll({
    where: { applicationId: application.id, state: 'waiting' },
    transaction,
  })
  const applicant = await Organisation.findByPk(application.applicantOrganisationId, {
    attributes: ['name'],
    transaction,
  })
  for (const r of opened) {
    const hit = affected.get(r.ownerOrganisationId)!
    const mail = reviewOpenedMail({
      publicUrl: cfg.publicUrl,
      reviewId: r.id,
      ownerName: names.get(r.ownerOrganisationId) ?? 'network owner',
      reference: application.reference ?? `#${application.id}`,
      title: application.title,
      siteAddress: application.siteAddress,
      applicantName: applicant?.name ?? 'An applicant',
      affectedSegmentCount: hit.count,
      worstVerdict: hit.worst,
      dueOn,
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
    await recordAudit(
      {
        actorUserId: actorUserId,
        action: 'review-opened',
        entityType: 'owner_review',
        entityId: r.id,
        details: {
          applicationId: application.id,
          ownerOrganisationId: r.ownerOrganisationId,
          dueOn,
          affectedSegmentCount: hit.count,
        },
      },
      transaction,
    )
  }

  const status: ApplicationStatus = opened.length ? 'with_owners' : 'ready_for_decision'
  // The submit that called this already moved the version on; one change, one version.
  application.status = status
  await application.save({ transaction })
  await recordAudit(
    {
      actorUserId,
      action: 'application-status-changed',
      entityType: 'application',
      entityId: application.id,
      details: {
        status,
        ownersAffected: opened.length,
        ownersNotAffected: ownerIds.size - opened.length,
      },
    },
    transaction,
  )
  return status
}
