import { Op, QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import type {
  CoordinationPeriod,
  CoordinationWorksQuery,
} from '../../shared/schemas/coordination.ts'
import {
  dateSpanInPlainWords,
  pipeInPlainWords,
} from '../../shared/screening/combined-statement.ts'
import { rangesOverlap } from '../../shared/screening/concurrency-intervals.ts'
import type { DateRange } from '../../shared/screening/concurrency-intervals.ts'
import type { AssessmentResult, Verdict } from '../../shared/statics/types.ts'
import type {
  Clash,
  ClashApplication,
  ClashList,
  CoordinationWorksCollection,
  StoredCombinedScreening,
  Timeline,
} from '../../shared/types/coordination.ts'
import type { PipeMedium } from '../../shared/types/network.ts'
import { CHECK_LABELS, VERDICT_RANK } from '../../shared/types/screening.ts'
import { config } from '../config.ts'
import { forbidden } from '../errors.ts'
import { Activity, Assessment, Organisation, User } from '../models/index.ts'
import { liveWorks } from './live-works.ts'
import { segmentLines } from './reviews.ts'
import type { LiveWorks } from './live-works.ts'
import { isoToday } from './review-clock.ts'
import { activitiesNearStreets } from './street-proximity.ts'

/**
 * Project rule for "two excavations in the same street at the same time": each excavation's
 * footprint lies within this distance of a street centre line of the same name, the two belong
 * to different live applications and their days overlap. 5 m covers a carriageway half-width
 * plus a footway, so a pit on the pavement counts as in the street; it is deliberately wide
 * (more pairs listed for the officer to look at rather than a clash missed).
 */
export const SAME_STREET_DISTANCE_M = 5

/** How far the timeline looks for an application's nearest street, m. */
export const TIMELINE_STREET_SEARCH_M = 100

function parseJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T
}

function officer(user: User): void {
  if (user.role !== 'permit_officer' && user.role !== 'admin') throw forbidden()
}

const clip = (a: DateRange, b: DateRange): DateRange => ({
  from: a.from > b.from ? a.from : b.from,
  to: a.to < b.to ? a.to : b.to,
})

const asClashApplication = (w: LiveWorks): ClashApplication => ({
  applicationId: w.applicationId,
  reference: w.reference,
  title: w.title,
  status: w.status,
  startsOn: w.from,
  endsOn: w.to,
})

async function liveInPeriod(period: DateRange, now: Date): Promise<Map<number, LiveWorks>> {
  const all = await liveWorks('all', isoToday(now))
  return new Map([...all].filter(([, w]) => rangesOverlap(w, period)))
}

/**
 * Every activity of the live applications whose days overlap the period, as GeoJSON in WGS84,
 * optionally only those whose footprint meets the bounding box.
 */
export async function coordinationWorks(
  sequelize: Sequelize,
  user: User,
  query: CoordinationWorksQuery,
  now = new Date(),
): Promise<CoordinationWorksCollection> {
  officer(user)
  const live = await liveInPeriod(query, now)
  if (!live.size) return { type: 'FeatureCollection', features: [] }
  const ids = [...live.keys()]
  let activityIds: Set<number> | null = null
  if (query.bbox) {
    const epsg = config().PROJECTED_EPSG
    const t = crsTransform(epsg)
    const [w, s, e, n] = query.bbox
    const ring = [
      [w, s],
      [e, s],
      [e, n],
      [w, n],
      [w, s],
    ].map((p) => t.toGrid(p).join(' '))
    const rows = await sequelize.query<{ id: number }>(
      `SELECT id FROM activities
        WHERE MBRIntersects(geom, ST_GeomFromText(?, ${Number(epsg)})) AND application_id IN (?)`,
      { replacements: [`POLYGON((${ring.join(',')}))`, ids], type: QueryTypes.SELECT },
    )
    activityIds = new Set(rows.map((r) => Number(r.id)))
  }
  const activities = await Activity.findAll({
    where: { applicationId: { [Op.in]: ids } },
    attributes: ['id', 'applicationId', 'position', 'kind', 'label', 'input'],
    order: [
      ['applicationId', 'ASC'],
      ['position', 'ASC'],
    ],
  })
  return {
    type: 'FeatureCollection',
    features: activities
      .filter((a) => !activityIds || activityIds.has(a.id))
      .map((a) => {
        const w = live.get(a.applicationId)!
        const input = parseJson<ActivityInput>(a.input)
        return {
          type: 'Feature' as const,
          id: a.id,
          properties: {
            applicationId: w.applicationId,
            reference: w.reference,
            title: w.title,
            status: w.status,
            startsOn: w.from,
            endsOn: w.to,
            activityId: a.id,
            kind: a.kind,
            label: a.label,
          },
          geometry: input.geometry as CoordinationWorksCollection['features'][number]['geometry'],
        }
      }),
  }
}

function combinedReason(
  refs: string[],
  owner: string,
  medium: string,
  alone: Verdict,
  combined: Verdict,
  period: DateRange,
  result: AssessmentResult,
): string {
  const governing = result.checks.find((c) => c.governing)
  const check = governing
    ? ` ${CHECK_LABELS[governing.id]} reaches ${Math.round(governing.withWorks.utilisation * 100)} % of capacity.`
    : ''
  return (
    `${refs.join(' and ')} are each ${alone === 'clear' ? 'clear' : `at most ${alone}`} alone, ` +
    `but together they make the result for ${owner}'s ${pipeInPlainWords(medium)} ${combined} ` +
    `from ${dateSpanInPlainWords(period.from, period.from)} to ${dateSpanInPlainWords(period.to, period.to)}.${check}`
  )
}

/**
 * The clashes in a period: (1) a segment whose combined verdict in some interval is worse than
 * the alone verdict of each application in it; (2) two live excavations near the same street
 * at the same time (SAME_STREET_DISTANCE_M). Each clash is listed once.
 */
export async function coordinationClashes(
  sequelize: Sequelize,
  user: User,
  period: CoordinationPeriod,
  now = new Date(),
): Promise<ClashList> {
  officer(user)
  const live = await liveInPeriod(period, now)
  const items: Clash[] = []
  const ids = [...live.keys()]

  if (ids.length) {
    const combinedRows = await Assessment.findAll({
      where: { applicationId: { [Op.in]: ids }, combinedVerdict: { [Op.ne]: null } },
      order: [['id', 'ASC']],
    })
    const segmentIds = [...new Set(combinedRows.map((r) => r.pipeSegmentId))]
    const onSegments = segmentIds.length
      ? await Assessment.findAll({
          where: { pipeSegmentId: { [Op.in]: segmentIds }, applicationId: { [Op.in]: ids } },
          attributes: ['applicationId', 'pipeSegmentId', 'verdict'],
        })
      : []
    const alone = new Map(
      onSegments.map((r) => [`${r.applicationId}:${r.pipeSegmentId}`, r.verdict]),
    )
    const owners = new Map(
      (
        await Organisation.findAll({
          where: { id: [...new Set(combinedRows.map((r) => r.ownerOrganisationId))] },
          attributes: ['id', 'name'],
        })
      ).map((o) => [o.id, o.name]),
    )
    const seen = new Set<string>()
    for (const row of combinedRows) {
      const stored = parseJson<StoredCombinedScreening>(row.combined)
      const worst = stored.worst
      if (!rangesOverlap(worst, period)) continue
      const appIds = [row.applicationId, ...worst.applicationIds].sort((a, b) => a - b)
      if (!appIds.every((id) => live.has(id))) continue
      const verdicts = appIds.map((id) => alone.get(`${id}:${row.pipeSegmentId}`) ?? 'clear')
      const worstAlone = verdicts.reduce<Verdict>(
        (m, v) => (VERDICT_RANK[v] > VERDICT_RANK[m] ? v : m),
        'clear',
      )
      if (VERDICT_RANK[worst.verdict] <= VERDICT_RANK[worstAlone]) continue
      const key = `${row.pipeSegmentId}|${appIds.join(',')}|${worst.from}|${worst.to}`
      if (seen.has(key)) continue
      seen.add(key)
      const apps = appIds.map((id) => asClashApplication(live.get(id)!))
      const owner = owners.get(row.ownerOrganisationId) ?? ''
      items.push({
        kind: 'combined-load',
        from: worst.from,
        to: worst.to,
        applications: apps,
        segment: {
          id: row.pipeSegmentId,
          owner: { id: row.ownerOrganisationId, name: owner },
          medium: row.medium as PipeMedium,
          geometry: null,
        },
        verdictAlone: worstAlone,
        verdictCombined: worst.verdict,
        reason: combinedReason(
          apps.map((a) => a.reference),
          owner,
          row.medium,
          worstAlone,
          worst.verdict,
          worst,
          stored.result,
        ),
      })
    }

    const lines = await segmentLines(sequelize, segmentIds)
    for (const item of items) {
      if (item.kind !== 'combined-load') continue
      const line = lines.get(item.segment.id)
      if (line) item.segment.geometry = { type: 'LineString', coordinates: line }
    }

    const near = await activitiesNearStreets(sequelize, ids, SAME_STREET_DISTANCE_M, ['excavation'])
    const byStreet = new Map<string, Set<number>>()
    for (const n of near) {
      const set = byStreet.get(n.street) ?? new Set<number>()
      set.add(n.applicationId)
      byStreet.set(n.street, set)
    }
    for (const [street, set] of [...byStreet].sort((a, b) => a[0].localeCompare(b[0]))) {
      const list = [...set].sort((a, b) => a - b)
      for (let i = 0; i < list.length; i++) {
        for (let j = i + 1; j < list.length; j++) {
          const a = live.get(list[i]!)!
          const b = live.get(list[j]!)!
          if (!rangesOverlap(a, b)) continue
          const both = clip(clip(a, b), period)
          if (both.from > both.to) continue
          items.push({
            kind: 'same-street',
            ...both,
            applications: [asClashApplication(a), asClashApplication(b)],
            street,
            reason:
              `${a.reference} and ${b.reference} both dig in ${street} ` +
              `from ${dateSpanInPlainWords(both.from, both.from)} to ${dateSpanInPlainWords(both.to, both.to)}.`,
          })
        }
      }
    }
  }

  items.sort(
    (p, q) =>
      p.from.localeCompare(q.from) || (p.kind === q.kind ? 0 : p.kind === 'combined-load' ? -1 : 1),
  )
  return {
    from: period.from,
    to: period.to,
    items,
    rules: [
      'A combined-load clash: in some period the works of several live applications together give a worse screening result for a pipe segment than any one of them alone. Every activity of an application is assumed to be in place on every day of its dates (or of its permit once granted).',
      `A same-street clash: excavations of two live applications lie within ${SAME_STREET_DISTANCE_M} m of a street of the same name, on overlapping days.`,
      'Live means submitted, with owners, ready for decision, or granted and not past the end of its permit.',
    ],
  }
}

/**
 * Live applications in a period, grouped by the street nearest to any of their activities
 * (within TIMELINE_STREET_SEARCH_M; otherwise in a group without a street), by start date.
 */
export async function coordinationTimeline(
  sequelize: Sequelize,
  user: User,
  period: CoordinationPeriod,
  now = new Date(),
): Promise<Timeline> {
  officer(user)
  const live = await liveInPeriod(period, now)
  const near = await activitiesNearStreets(sequelize, [...live.keys()], TIMELINE_STREET_SEARCH_M)
  const nearest = new Map<number, { street: string; distance_m: number }>()
  for (const n of near) {
    const prev = nearest.get(n.applicationId)
    if (
      !prev ||
      n.distance_m < prev.distance_m ||
      (n.distance_m === prev.distance_m && n.street < prev.street)
    )
      nearest.set(n.applicationId, { street: n.street, distance_m: n.distance_m })
  }
  const groups = new Map<string | null, Timeline['groups'][number]>()
  for (const w of [...live.values()].sort(
    (a, b) => a.from.localeCompare(b.from) || a.applicationId - b.applicationId,
  )) {
    const n = nearest.get(w.applicationId)
    const street = n?.street ?? null
    const g = groups.get(street) ?? { street, applications: [] }
    g.applications.push({ ...asClashApplication(w), distanceToStreet_m: n?.distance_m ?? null })
    groups.set(street, g)
  }
  return {
    from: period.from,
    to: period.to,
    groups: [...groups.values()].sort((a, b) =>
      a.street === null ? 1 : b.street === null ? -1 : a.street.localeCompare(b.street),
    ),
  }
}
