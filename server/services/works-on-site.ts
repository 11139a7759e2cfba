import { Op } from 'sequelize'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import type { GeoJsonCollection } from '../../shared/types/site-works.ts'
import { SITE_STATE_LABELS } from '../../shared/types/site-works.ts'
import { forbidden } from '../errors.ts'
import { Activity, Application, EmergencyWorks, Permit } from '../models/index.ts'
import type { User } from '../models/index.ts'
import { isFollowUpOverdue } from './emergency-works.ts'
import { isoToday } from './review-clock.ts'
import { parseJson } from './review-dto.ts'
import { siteStates } from './site-works.ts'

/**
 * The permit office's map of works on the ground today: every activity of a granted
 * application whose current permit covers today, with its site state (`on_site` once started,
 * `not_started` before, `finished` after), and every emergency works not yet finished
 * (`emergency`, with `overdue` when its full application is late).
 */
export async function worksOnSite(user: User, now = new Date()): Promise<GeoJsonCollection> {
  if (user.role !== 'permit_officer' && user.role !== 'admin') throw forbidden()
  const today = isoToday(now)
  const permits = await Permit.findAll({
    where: { status: 'valid', validFrom: { [Op.lte]: today }, validTo: { [Op.gte]: today } },
    attributes: ['id', 'applicationId', 'number', 'validFrom', 'validTo', 'issue'],
    order: [['issue', 'ASC']],
  })
  const byApp = new Map(permits.map((p) => [p.applicationId, p]))
  const apps = byApp.size
    ? await Application.findAll({
        where: { id: { [Op.in]: [...byApp.keys()] }, status: 'granted' },
        attributes: ['id', 'reference', 'title', 'siteAddress'],
      })
    : []
  const states = await siteStates(apps.map((a) => a.id))
  const activities = apps.length
    ? await Activity.findAll({
        where: { applicationId: { [Op.in]: apps.map((a) => a.id) } },
        attributes: ['id', 'applicationId', 'kind', 'label', 'input'],
        order: [
          ['applicationId', 'ASC'],
          ['position', 'ASC'],
        ],
      })
    : []
  const appsById = new Map(apps.map((a) => [a.id, a]))
  const features: GeoJsonCollection['features'] = activities.map((x) => {
    const a = appsById.get(x.applicationId)!
    const p = byApp.get(x.applicationId)!
    const state = states.get(a.id) ?? 'not_started'
    return {
      type: 'Feature',
      id: `activity-${x.id}`,
      properties: {
        source: 'permit',
        applicationId: a.id,
        reference: a.reference ?? `#${a.id}`,
        title: a.title,
        siteAddress: a.siteAddress,
        permitNumber: p.number,
        validFrom: p.validFrom,
        validTo: p.validTo,
        kind: x.kind,
        label: x.label,
        state,
        stateLabel: SITE_STATE_LABELS[state],
      },
      geometry: parseJson<ActivityInput>(x.input).geometry as {
        type: string
        coordinates: unknown
      },
    }
  })
  const emergencies = await EmergencyWorks.findAll({
    where: { finishedAt: null },
    order: [['id', 'ASC']],
  })
  for (const w of emergencies) {
    features.push({
      type: 'Feature',
      id: `emergency-${w.id}`,
      properties: {
        source: 'emergency',
        emergencyWorksId: w.id,
        reference: w.reference ?? `EW-${w.id}`,
        title: `Emergency: ${w.reason.slice(0, 80)}`,
        siteAddress: w.siteAddress,
        kind: w.activityKind,
        state: 'emergency',
        stateLabel: 'Emergency works',
        followUpDueAt: w.followUpDueAt.toISOString(),
        overdue: isFollowUpOverdue(w, now),
      },
      geometry: parseJson<{ type: string; coordinates: unknown }>(w.location),
    })
  }
  return { type: 'FeatureCollection', features }
}
