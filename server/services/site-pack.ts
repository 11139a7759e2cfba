import { buffer, lineString } from '@turf/turf'
import QRCode from 'qrcode'
import { Op } from 'sequelize'
import type { Sequelize } from 'sequelize'
import type { SiteChecklistInput } from '../../shared/schemas/site-works.ts'
import { formatVerificationCode } from '../../shared/schemas/verification.ts'
import { STANDARD_CAUTION } from '../../shared/statics/index.ts'
import type { PermitCondition } from '../../shared/types/permits.ts'
import type {
  GeoJsonCollection,
  SitePackCondition,
  SitePackContact,
  SitePackDto,
  SitePackTick,
} from '../../shared/types/site-works.ts'
import { domainRule, notFound } from '../errors.ts'
import {
  Activity,
  Assessment,
  Organisation,
  SiteChecklist,
  SiteEvent,
  User,
} from '../models/index.ts'
import type { Permit } from '../models/index.ts'
import { applicationForParty } from './application-parties.ts'
import { effectivePermitStatus } from './permit-issue.ts'
import { verificationUrl } from './permit-document-data.ts'
import { parseJson } from './review-dto.ts'
import { activityFeatures, segmentLines } from './reviews.ts'
import { siteRequirements } from './site-requirements.ts'
import { currentPermit, siteStateOf } from './site-works.ts'

/**
 * Project rule: the hand-dig zone drawn in the site pack is a band 0.6 m either side of every
 * pipe the works reach — the widest of the published hand-dig distances we know (0.30 m
 * beside the line in German practice, about 0.5 m in UK practice, 18–24 in in US practice).
 * Records are not exact; the crew still locates and trial-holes. An owner's own condition
 * with a larger distance governs and is on the checklist.
 */
export const HAND_DIG_WIDTH_M = 0.6

/** Key of a condition on the checklist of one permit issue. */
export const conditionKey = (index: number, code: string) => `${index}:${code}`

async function loadPack(user: User, applicationId: number) {
  const a = await applicationForParty(user, applicationId)
  if (!a) throw notFound('application', applicationId)
  const permit = await currentPermit(a.id)
  if (!permit) throw notFound('permit of application', applicationId)
  return { a, permit }
}

function checklistOf(permit: Permit): SitePackCondition[] {
  return parseJson<PermitCondition[]>(permit.conditions).map((c, i) => ({
    ...c,
    key: conditionKey(i, c.code),
  }))
}

/**
 * Everything the crew needs on site for one permit, in one response: validity, the conditions
 * as a checklist with the ticks stored so far, the map (works, pipes to protect, hand-dig
 * zones), the owners' contacts and the verification code with its QR.
 */
export async function sitePack(
  sequelize: Sequelize,
  user: User,
  applicationId: number,
  now = new Date(),
): Promise<SitePackDto> {
  const { a, permit } = await loadPack(user, applicationId)
  const activities = await Activity.findAll({ where: { applicationId: a.id } })
  const assessments = await Assessment.findAll({
    where: { applicationId: a.id },
    attributes: ['pipeSegmentId', 'ownerOrganisationId', 'medium', 'verdict', 'distance_m'],
    order: [['id', 'ASC']],
  })
  const lines = await segmentLines(
    sequelize,
    assessments.map((s) => s.pipeSegmentId),
  )
  const ownerIds = [...new Set(assessments.map((s) => s.ownerOrganisationId))]
  const conditions = checklistOf(permit)
  for (const c of conditions) {
    if (c.ownerOrganisationId != null && !ownerIds.includes(c.ownerOrganisationId))
      ownerIds.push(c.ownerOrganisationId)
  }
  const owners = ownerIds.length
    ? await Organisation.findAll({
        where: { id: { [Op.in]: ownerIds } },
        attributes: ['id', 'name', 'medium'],
      })
    : []
  const engineers = ownerIds.length
    ? await User.findAll({
        where: { organisationId: { [Op.in]: ownerIds }, role: 'asset_engineer', active: true },
        attributes: ['organisationId', 'name', 'email'],
        order: [['id', 'ASC']],
      })
    : []
  const names = new Map(owners.map((o) => [o.id, o.name]))
  const req = await siteRequirements(parseJson<PermitCondition[]>(permit.conditions))
  const contacts: SitePackContact[] = owners
    .map((o) => {
      const attends = req.attendance.find((x) => x.owner.id === o.id)
      return {
        owner: { id: o.id, name: o.name },
        medium: o.medium,
        people: engineers
          .filter((u) => u.organisationId === o.id)
          .map((u) => ({ name: u.name, email: u.email })),
        attends: Boolean(attends),
        notice_h: attends?.notice_h ?? null,
      }
    })
    .sort((x, y) => x.owner.name.localeCompare(y.owner.name))

  const pipes: GeoJsonCollection = {
    type: 'FeatureCollection',
    features: assessments
      .filter((s) => (lines.get(s.pipeSegmentId) ?? []).length >= 2)
      .map((s) => ({
        type: 'Feature' as const,
        id: s.pipeSegmentId,
        properties: {
          medium: s.medium,
          owner: names.get(s.ownerOrganisationId) ?? '',
          verdict: s.verdict,
          distance_m: s.distance_m,
        },
        geometry: { type: 'LineString', coordinates: lines.get(s.pipeSegmentId)! },
      })),
  }
  const handDigZones: GeoJsonCollection = {
    type: 'FeatureCollection',
    features: pipes.features.flatMap((f) => {
      const zone = buffer(
        lineString(f.geometry.coordinates as [number, number][]),
        HAND_DIG_WIDTH_M,
        {
          units: 'meters',
          steps: 4,
        },
      )
      return zone
        ? [
            {
              type: 'Feature' as const,
              id: `zone-${String(f.id)}`,
              properties: { segmentId: f.id, width_m: HAND_DIG_WIDTH_M },
              geometry: zone.geometry as { type: string; coordinates: unknown },
            },
          ]
        : []
    }),
  }
  const events = await SiteEvent.findAll({
    where: { applicationId: a.id, kind: { [Op.in]: ['started', 'finished'] } },
    order: [['id', 'ASC']],
  })
  const checklist = await SiteChecklist.findOne({ where: { permitId: permit.id } })
  const url = verificationUrl(permit.verificationCode)
  return {
    applicationId: a.id,
    reference: a.reference ?? `#${a.id}`,
    title: a.title,
    siteAddress: a.siteAddress,
    contactName: a.contactName,
    contactPhone: a.contactPhone,
    permit: {
      id: permit.id,
      number: permit.number,
      issue: permit.issue,
      status: effectivePermitStatus(permit),
      validFrom: permit.validFrom,
      validTo: permit.validTo,
      verificationCode: formatVerificationCode(permit.verificationCode),
      verificationUrl: url,
      qrSvg: await QRCode.toString(url, { type: 'svg', errorCorrectionLevel: 'M', margin: 1 }),
    },
    site: {
      state: siteStateOf(events),
      startedAt: events.find((e) => e.kind === 'started')?.at.toISOString() ?? null,
      finishedAt: events.find((e) => e.kind === 'finished')?.at.toISOString() ?? null,
    },
    conditions,
    ticks: checklist ? parseJson<Record<string, SitePackTick>>(checklist.ticks) : {},
    contacts,
    map: {
      works: activityFeatures(activities) as unknown as GeoJsonCollection,
      pipes,
      handDigZones,
      handDigWidth_m: HAND_DIG_WIDTH_M,
    },
    caution: STANDARD_CAUTION,
    generatedAt: now.toISOString(),
  }
}

/**
 * Store the crew's ticks for the current permit issue. Keys must be conditions of that issue;
 * a tick not sent keeps its state. The applicant's users tick; the others only read.
 */
export async function saveChecklist(
  sequelize: Sequelize,
  user: User,
  applicationId: number,
  input: SiteChecklistInput,
  now = new Date(),
): Promise<Record<string, SitePackTick>> {
  const { a, permit } = await loadPack(user, applicationId)
  if (user.role !== 'applicant' || a.applicantOrganisationId !== user.organisationId) {
    throw domainRule('Only the applicant’s crew ticks the checklist')
  }
  const keys = new Set(checklistOf(permit).map((c) => c.key))
  const unknown = Object.keys(input.ticks).filter((k) => !keys.has(k))
  if (unknown.length) {
    throw domainRule(
      'Some ticks are for conditions that are not on the current permit; reload the site pack',
      unknown.map((k) => ({
        field: `ticks.${k}`,
        message: 'Not a condition of this permit issue',
      })),
    )
  }
  return sequelize.transaction(async (transaction) => {
    const row = await SiteChecklist.findOne({
      where: { permitId: permit.id },
      transaction,
      lock: transaction.LOCK.UPDATE,
    })
    const ticks = row ? { ...parseJson<Record<string, SitePackTick>>(row.ticks) } : {}
    for (const [k, v] of Object.entries(input.ticks)) {
      ticks[k] = { ticked: v, at: now.toISOString(), by: user.name }
    }
    if (row) await row.update({ ticks, updatedByUserId: user.id }, { transaction })
    else {
      await SiteChecklist.create(
        { permitId: permit.id, ticks, updatedByUserId: user.id },
        { transaction },
      )
    }
    return ticks
  })
}
