import { format } from 'date-fns'
import { Op } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import type {
  EmergencyFollowUpInput,
  EmergencyWorksInput,
} from '../../shared/schemas/site-works.ts'
import type { EmergencyWorksDto } from '../../shared/types/site-works.ts'
import { config } from '../config.ts'
import { domainRule, forbidden, notFound, validationFailed } from '../errors.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { emergencyAlertMail } from '../mail/templates/emergency-alert.ts'
import { Application, EmergencyWorks, Organisation } from '../models/index.ts'
import type { AlertedOwner } from '../models/emergency-works.ts'
import type { User } from '../models/index.ts'
import { recordAudit } from './audit.ts'
import { organisationEmails } from './mail-recipients.ts'
import { siteTime } from './site-works.ts'
import { findSegmentsNear } from './spatial-query.ts'
import type { GridShape } from './spatial-query.ts'

const ACTIVITY_WORDS = {
  excavation: 'an excavation',
  crane: 'a crane set-up',
  fill: 'a fill or stockpile',
}

/**
 * How far from emergency works owners are alerted. Project rule: the short form carries no
 * loads, so the engine's influence distance cannot be worked out; we search the larger of
 * EMERGENCY_ALERT_DISTANCE_M (default 25 m), the screening minimum and twice the given depth
 * (a 1:2 slope from the bottom of a pit reaches that far). Wider means more owners alerted.
 */
export function emergencyAlertDistance_m(depth_m: number | null | undefined): number {
  const cfg = config()
  return Math.max(cfg.EMERGENCY_ALERT_DISTANCE_M, cfg.SCREENING_MIN_DISTANCE_M, 2 * (depth_m ?? 0))
}

/** Emergency works are overdue when the deadline has passed and no submitted application follows. */
export const isFollowUpOverdue = (
  w: Pick<EmergencyWorks, 'followUpApplicationId' | 'followUpDueAt'>,
  now: Date,
) => w.followUpApplicationId == null && w.followUpDueAt.getTime() < now.getTime()

function toDto(w: EmergencyWorks, applicantName: string, now: Date): EmergencyWorksDto {
  return {
    id: w.id,
    reference: w.reference ?? `EW-${w.id}`,
    applicantOrganisation: { id: w.applicantOrganisationId, name: applicantName },
    siteAddress: w.siteAddress,
    activityKind: w.activityKind,
    depth_m: w.depth_m == null ? null : Number(w.depth_m),
    reason: w.reason,
    contactName: w.contactName,
    contactPhone: w.contactPhone,
    location: typeof w.location === 'string' ? JSON.parse(w.location) : w.location,
    startedAt: w.startedAt.toISOString(),
    followUpDueAt: w.followUpDueAt.toISOString(),
    followUpApplicationId: w.followUpApplicationId,
    overdue: isFollowUpOverdue(w, now),
    alertedOwners:
      typeof w.alertedOwners === 'string' ? JSON.parse(w.alertedOwners) : w.alertedOwners,
    finishedAt: w.finishedAt ? w.finishedAt.toISOString() : null,
  }
}

/**
 * Report emergency works: they may start at once. The owners with a pipe within the alert
 * distance (the screening's spatial search) are mailed at once, inside the same transaction;
 * the full application is due EMERGENCY_FOLLOW_UP_H hours after the start.
 */
export async function reportEmergencyWorks(
  sequelize: Sequelize,
  user: User,
  input: EmergencyWorksInput,
  now = new Date(),
): Promise<EmergencyWorksDto> {
  if (user.role !== 'applicant') throw forbidden()
  const cfg = config()
  const startedAt = input.startedAt ? new Date(input.startedAt) : now
  if (startedAt.getTime() > now.getTime() + 5 * 60_000) {
    throw validationFailed([
      { field: 'startedAt', message: 'Emergency works are reported once started' },
    ])
  }
  if (now.getTime() - startedAt.getTime() > cfg.EMERGENCY_FOLLOW_UP_H * 3_600_000) {
    throw validationFailed([
      {
        field: 'startedAt',
        message: `Report emergency works within ${cfg.EMERGENCY_FOLLOW_UP_H} hours of the start`,
      },
    ])
  }
  const t = crsTransform(cfg.PROJECTED_EPSG)
  const shape: GridShape =
    input.location.type === 'Point'
      ? { type: 'Points', coordinates: [t.toGrid(input.location.coordinates) as [number, number]] }
      : {
          type: 'Polygon',
          rings: input.location.coordinates.map((r) =>
            r.map((p) => t.toGrid(p) as [number, number]),
          ),
        }
  const near = await findSegmentsNear(
    sequelize,
    cfg.PROJECTED_EPSG,
    shape,
    emergencyAlertDistance_m(input.depth_m),
  )
  const byOwner = new Map<number, AlertedOwner>()
  for (const s of near) {
    const o = byOwner.get(s.ownerOrganisationId)
    if (!o) {
      byOwner.set(s.ownerOrganisationId, {
        id: s.ownerOrganisationId,
        name: s.ownerName,
        segments: 1,
        nearest_m: Math.round(s.distance_m * 10) / 10,
      })
    } else {
      o.segments++
      o.nearest_m = Math.min(o.nearest_m, Math.round(s.distance_m * 10) / 10)
    }
  }
  const alerted = [...byOwner.values()].sort((a, b) => a.nearest_m - b.nearest_m)
  const followUpDueAt = new Date(startedAt.getTime() + cfg.EMERGENCY_FOLLOW_UP_H * 3_600_000)
  const applicant = await Organisation.findByPk(user.organisationId, { attributes: ['name'] })
  const id = await sequelize.transaction(async (transaction) => {
    const w = await EmergencyWorks.create(
      {
        reference: null,
        applicantOrganisationId: user.organisationId,
        createdByUserId: user.id,
        location: input.location,
        siteAddress: input.siteAddress,
        activityKind: input.activityKind,
        depth_m: input.depth_m ?? null,
        reason: input.reason,
        contactName: input.contactName,
        contactPhone: input.contactPhone,
        startedAt,
        followUpDueAt,
        followUpApplicationId: null,
        alertedOwners: alerted,
        finishedAt: null,
      },
      { transaction },
    )
    w.reference = `EW-${format(startedAt, 'yyyy')}-${String(w.id).padStart(5, '0')}`
    await w.save({ transaction })
    for (const o of alerted) {
      const mail = emergencyAlertMail({
        ownerName: o.name,
        reference: w.reference,
        applicantName: applicant?.name ?? 'An applicant',
        siteAddress: input.siteAddress,
        activity: ACTIVITY_WORDS[input.activityKind],
        depth_m: input.depth_m ?? null,
        reason: input.reason,
        contactName: input.contactName,
        contactPhone: input.contactPhone,
        startedAt: siteTime(startedAt),
        segments: o.segments,
        nearest_m: o.nearest_m,
        followUpDue: siteTime(followUpDueAt),
      })
      for (const to of await organisationEmails(o.id, 'asset_engineer', transaction)) {
        await enqueueMail(
          { to: [to], ...mail, related: { type: 'emergency_works', id: w.id } },
          transaction,
        )
      }
    }
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'emergency-works-reported',
        entityType: 'emergency_works',
        entityId: w.id,
        details: {
          alertedOwners: alerted.map((o) => o.id),
          followUpDueAt: followUpDueAt.toISOString(),
        },
      },
      transaction,
    )
    return w.id
  })
  return toDto((await EmergencyWorks.findByPk(id))!, applicant?.name ?? '', now)
}

/**
 * Emergency works the user may see: the applicant's own; for the office all (overdue first,
 * then the soonest deadline); for an engineer those its organisation was alerted about.
 */
export async function listEmergencyWorks(
  user: User,
  now = new Date(),
): Promise<EmergencyWorksDto[]> {
  let rows: EmergencyWorks[]
  if (user.role === 'applicant') {
    rows = await EmergencyWorks.findAll({
      where: { applicantOrganisationId: user.organisationId },
      order: [['id', 'DESC']],
      limit: 200,
    })
  } else if (user.role === 'permit_officer' || user.role === 'admin') {
    rows = await EmergencyWorks.findAll({ order: [['followUpDueAt', 'ASC']], limit: 500 })
  } else if (user.role === 'asset_engineer') {
    rows = (await EmergencyWorks.findAll({ order: [['id', 'DESC']], limit: 500 })).filter((w) =>
      toDto(w, '', now).alertedOwners.some((o) => o.id === user.organisationId),
    )
  } else throw forbidden()
  const names = new Map(
    (
      await Organisation.findAll({
        where: { id: { [Op.in]: [0, ...new Set(rows.map((r) => r.applicantOrganisationId))] } },
        attributes: ['id', 'name'],
      })
    ).map((o) => [o.id, o.name]),
  )
  const list = rows.map((r) => toDto(r, names.get(r.applicantOrganisationId) ?? '', now))
  return list.sort((a, b) => Number(b.overdue) - Number(a.overdue))
}

/** How many emergency works are past their follow-up deadline without an application. */
export function countOverdueFollowUps(now = new Date()): Promise<number> {
  return EmergencyWorks.count({
    where: { followUpApplicationId: null, followUpDueAt: { [Op.lt]: now } },
  })
}

/** Link the full application (submitted, the applicant's own) that follows emergency works. */
export async function linkFollowUp(
  user: User,
  id: number,
  input: EmergencyFollowUpInput,
  now = new Date(),
): Promise<EmergencyWorksDto> {
  if (user.role !== 'applicant') throw forbidden()
  const w = await EmergencyWorks.findByPk(id)
  if (!w || w.applicantOrganisationId !== user.organisationId) throw notFound('emergency works', id)
  if (w.followUpApplicationId) throw domainRule('The full application is already linked')
  const a = await Application.findByPk(input.applicationId)
  if (!a || a.applicantOrganisationId !== user.organisationId) {
    throw validationFailed([{ field: 'applicationId', message: 'Not one of your applications' }])
  }
  if (a.status === 'draft') {
    throw validationFailed([{ field: 'applicationId', message: 'Submit the application first' }])
  }
  await w.update({ followUpApplicationId: a.id })
  await recordAudit({
    actorUserId: user.id,
    action: 'emergency-follow-up-linked',
    entityType: 'emergency_works',
    entityId: w.id,
    details: {
      applicationId: a.id,
      late: isFollowUpOverdue({ followUpApplicationId: null, followUpDueAt: w.followUpDueAt }, now),
    },
  })
  const org = await Organisation.findByPk(w.applicantOrganisationId, { attributes: ['name'] })
  return toDto(w, org?.name ?? '', now)
}
