import { Op } from 'sequelize'
import type { WhereOptions } from 'sequelize'
import type { HistoryEntryDto } from '../../shared/types/history.ts'
import { notFound } from '../errors.ts'
import { AuditEvent, Organisation, OwnerReview, Permit, User } from '../models/index.ts'
import { applicationForParty } from './application-parties.ts'
import { parseJson } from './review-dto.ts'

const SUMMARIES: Record<string, string> = {
  'application-created': 'Draft created',
  'application-submitted': 'Application submitted and screened',
  'application-withdrawn': 'Application withdrawn',
  'application-status-changed': 'Status changed',
  'application-granted': 'Permit granted',
  'application-refused': 'Application refused',
  'review-opened': 'Owner review opened',
  'review-decided': 'Owner decided',
  'review-decision-superseded': 'Owner changed its decision',
  'review-question-answered': 'Applicant answered a question',
  'segment-rerun': 'Owner re-ran a pipe check with corrected data',
  'permit-issued': 'Permit document issued',
  'permit-extended': 'Permit extended',
  'permit-varied': 'Permit conditions changed',
  'permit-revoked': 'Permit revoked',
}

/**
 * The history of an application for its parties: every state change and decision with who,
 * when and what, oldest first. An owner's engineer sees the application's own events and the
 * events of their organisation's review only; re-runs are shown to their owner alone.
 */
export async function applicationHistory(
  user: User,
  applicationId: number,
): Promise<HistoryEntryDto[]> {
  const a = await applicationForParty(user, applicationId)
  if (!a) throw notFound('application', applicationId)
  const reviews = await OwnerReview.findAll({
    where: { applicationId, state: { [Op.ne]: 'not_affected' } },
    attributes: ['id', 'ownerOrganisationId'],
  })
  const visibleReviews = reviews.filter(
    (r) => user.role !== 'asset_engineer' || r.ownerOrganisationId === user.organisationId,
  )
  const permits = await Permit.findAll({ where: { applicationId }, attributes: ['id'] })
  const or: WhereOptions<AuditEvent>[] = [
    { entityType: 'application', entityId: String(applicationId) },
  ]
  if (visibleReviews.length) {
    or.push({
      entityType: 'owner_review',
      entityId: { [Op.in]: visibleReviews.map((r) => String(r.id)) },
    })
  }
  if (permits.length)
    or.push({ entityType: 'permit', entityId: { [Op.in]: permits.map((p) => String(p.id)) } })
  const events = await AuditEvent.findAll({
    where: { [Op.or]: or },
    include: [
      {
        model: User,
        as: 'actor',
        attributes: ['id', 'name'],
        include: [{ model: Organisation, as: 'organisation', attributes: ['name'] }],
      },
    ],
    order: [['id', 'ASC']],
  })
  const ownRerun = (e: AuditEvent) => {
    const d = parseJson<Record<string, unknown> | null>(e.details)
    return user.role === 'asset_engineer' && d?.ownerOrganisationId === user.organisationId
  }
  return events
    .filter((e) => e.action !== 'segment-rerun' || user.role === 'admin' || ownRerun(e))
    .map((e) => {
      const details = parseJson<Record<string, unknown> | null>(e.details)
      const extra = details?.decision ?? details?.status
      return {
        id: Number(e.id),
        at: e.at.toISOString(),
        actor: e.actor
          ? { id: e.actor.id, name: e.actor.name, organisation: e.actor.organisation?.name ?? null }
          : null,
        action: e.action,
        summary: `${SUMMARIES[e.action] ?? e.action}${extra ? `: ${String(extra).replace(/_/g, ' ')}` : ''}`,
        details,
      }
    })
}
