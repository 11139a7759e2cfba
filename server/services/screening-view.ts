import { buffer as turfBuffer, polygon as turfPolygon } from '@turf/turf'
import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import {
  gridActivityInfluence_m,
  toGridActivities,
} from '../../shared/screening/engine-activities.ts'
import { STANDARD_CAUTION } from '../../shared/statics/index.ts'
import type { AssessmentResult, Verdict } from '../../shared/statics/types.ts'
import type { PipeMedium } from '../../shared/types/network.ts'
import { CHECK_LABELS, countedVerdict, VERDICT_RANK } from '../../shared/types/screening.ts'
import type {
  AffectedPipeForApplicant,
  ApplicationScreeningDto,
  OwnerScreening,
} from '../../shared/types/screening.ts'
import { config } from '../config.ts'
import { combinedStatement } from './combined-statement-view.ts'
import { Assessment, Organisation } from '../models/index.ts'

function parseJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T
}

/** The project rules that switched, in plain words and without the owner's numbers. */
export function rulesAppliedInPlainWords(r: AssessmentResult): string[] {
  const out: string[] = []
  const e = r.effects
  if (e.wallFrictionLost) {
    out.push(
      'The excavation disturbs the original trench wall, so its friction no longer eases the soil load.',
    )
  }
  if (e.lateralSupportReduced)
    out.push(
      'The excavation goes below the pipe’s mid-height beside it and takes away side support.',
    )
  if (e.undermined) out.push('The pipe lies in the zone where the excavation face could slip.')
  if (e.shallowCover)
    out.push('The pipe lies shallow: loads at the surface reach it with little spreading.')
  if (e.exposedSpan_m > 0)
    out.push(`The excavation exposes the pipe over about ${e.exposedSpan_m.toFixed(1)} m.`)
  return out
}

/**
 * The screening of an application as its applicant may see it: per network owner, the affected
 * pipes with verdict, governing check, conditions and the rules that switched — no design data.
 */
export async function applicantScreening(
  sequelize: Sequelize,
  applicationId: number,
  activities: readonly ActivityInput[],
  screenedAt: Date | null,
): Promise<ApplicationScreeningDto> {
  const cfg = config()
  const t = crsTransform(cfg.PROJECTED_EPSG)
  // The stored engine input is not shown here; leaving it out keeps the read small.
  const rows = await Assessment.findAll({
    where: { applicationId },
    attributes: { exclude: ['engineInput'] },
    order: [['id', 'ASC']],
  })
  const owners = await Organisation.findAll({
    where: { kind: 'network_owner' },
    order: [['name', 'ASC']],
  })

  const geometries = new Map<number, [number, number][]>()
  if (rows.length) {
    const geo = await sequelize.query<{ id: number; g: unknown }>(
      'SELECT id, ST_AsGeoJSON(geom) AS g FROM pipe_segments WHERE id IN (?)',
      { replacements: [rows.map((r) => r.pipeSegmentId)], type: QueryTypes.SELECT },
    )
    for (const r of geo) {
      const coords = parseJson<{ coordinates: number[][] }>(r.g).coordinates
      geometries.set(
        Number(r.id),
        coords.map((c) => t.toLonLat(c)),
      )
    }
  }

  const byOwner = new Map<number, AffectedPipeForApplicant[]>()
  for (const a of rows) {
    const result = parseJson<AssessmentResult>(a.result)
    const governing = result.checks.find((c) => c.governing)
    const item: AffectedPipeForApplicant = {
      assessmentId: a.id,
      medium: a.medium as PipeMedium,
      verdict: a.verdict,
      governingCheck: governing
        ? {
            id: governing.id,
            label: CHECK_LABELS[governing.id],
            utilisationWithWorks: governing.withWorks.utilisation,
          }
        : null,
      summary: result.summary,
      distance_m: a.distance_m,
      conditions: result.conditions.map((c) => ({ code: c.code, text: c.text, reason: c.reason })),
      rulesApplied: rulesAppliedInPlainWords(result),
      geometry: { type: 'LineString', coordinates: geometries.get(a.pipeSegmentId) ?? [] },
      combined: combinedStatement(a),
    }
    const list = byOwner.get(a.ownerOrganisationId) ?? []
    list.push(item)
    byOwner.set(a.ownerOrganisationId, list)
  }

  let worst: Verdict | 'not-affected' = 'not-affected'
  const ownerViews: OwnerScreening[] = owners.map((o) => {
    const affected = byOwner.get(o.id) ?? []
    let verdict: Verdict | 'not-affected' = 'not-affected'
    for (const p of affected) {
      const counted = countedVerdict(p.verdict, p.combined)
      if (VERDICT_RANK[counted] > VERDICT_RANK[verdict]) verdict = counted
    }
    if (VERDICT_RANK[verdict] > VERDICT_RANK[worst]) worst = verdict
    return { organisation: { id: o.id, name: o.name, medium: o.medium }, verdict, affected }
  })

  const grid = toGridActivities(activities, t)
  const influenceZones = grid.map((g) => {
    const distance_m = gridActivityInfluence_m(g, cfg.SCREENING_MIN_DISTANCE_M)
    const ring = g.ring_grid.map((p) => t.toLonLat(p))
    const zone = turfBuffer(turfPolygon([[...ring, ring[0]!]]), distance_m, {
      units: 'meters',
      steps: 8,
    })
    return {
      activityIndex: g.sourceIndex,
      distance_m,
      geometry: zone!.geometry as ApplicationScreeningDto['influenceZones'][number]['geometry'],
    }
  })

  return {
    applicationId,
    screenedAt: screenedAt ? screenedAt.toISOString() : null,
    verdict: worst,
    owners: ownerViews.sort(
      (a, b) =>
        VERDICT_RANK[b.verdict] - VERDICT_RANK[a.verdict] ||
        a.organisation.name.localeCompare(b.organisation.name),
    ),
    influenceZones,
    caution: STANDARD_CAUTION,
  }
}
