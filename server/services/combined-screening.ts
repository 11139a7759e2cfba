import { Op, QueryTypes } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'
import { pipePieces } from '../../shared/geo/pipe-local-frame.ts'
import type { PipePiece } from '../../shared/geo/pipe-local-frame.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import { combinedStatementText } from '../../shared/screening/combined-statement.ts'
import { worstCombinedScreening } from '../../shared/screening/combined-screening.ts'
import type { WorksOnSegment } from '../../shared/screening/combined-screening.ts'
import {
  concurrencyIntervals,
  rangesOverlap,
} from '../../shared/screening/concurrency-intervals.ts'
import {
  gridActivityInfluence_m,
  toGridActivities,
} from '../../shared/screening/engine-activities.ts'
import { crsTransform } from '../../shared/geo/crs.ts'
import type { AssessmentInput, Verdict } from '../../shared/statics/types.ts'
import type {
  ConcurrentWorksSummary,
  StoredCombinedScreening,
} from '../../shared/types/coordination.ts'
import { VERDICT_RANK } from '../../shared/types/screening.ts'
import { config } from '../config.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { combinedWorsenedMail } from '../mail/templates/combined-worsened.ts'
import { Activity, Assessment, Organisation } from '../models/index.ts'
import { liveWorks } from './live-works.ts'
import type { LiveWorks } from './live-works.ts'
import { organisationEmails, roleEmails } from './mail-recipients.ts'
import { lockSegments } from './segment-locks.ts'
import { isoToday } from './review-clock.ts'

function parseJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T
}

/** A granted permit whose combined result got worse in a re-screen. */
export interface CombinedWorsening {
  applicationId: number
  assessmentId: number
  verdictBefore: Verdict
  verdictNow: Verdict
}

/** What one re-screen did, for audit details and the benchmark. */
export interface RescreenSummary {
  /** Segments the changed application affects. */
  segments: number
  /** (application, segment) pairs recomputed. */
  pairs: number
  worsened: CombinedWorsening[]
}

/** The verdict that counts for an assessment: combined when other works overlap, else alone. */
export function effectiveVerdict(a: {
  verdict: Verdict
  combinedVerdict: Verdict | null
}): Verdict {
  const c = a.combinedVerdict
  return c && VERDICT_RANK[c] > VERDICT_RANK[a.verdict] ? c : a.verdict
}

async function segmentPieces(
  sequelize: Sequelize,
  ids: readonly number[],
  transaction: Transaction,
): Promise<Map<number, PipePiece[]>> {
  const rows = await sequelize.query<{ id: number; g: unknown }>(
    'SELECT id, ST_AsGeoJSON(geom) AS g FROM pipe_segments WHERE id IN (?)',
    { replacements: [ids], type: QueryTypes.SELECT, transaction },
  )
  return new Map(
    rows.map((r) => [
      Number(r.id),
      pipePieces(parseJson<{ coordinates: [number, number][] }>(r.g).coordinates),
    ]),
  )
}

async function worksOf(
  ids: readonly number[],
  transaction: Transaction,
): Promise<Map<number, { works: WorksOnSegment; kinds: ActivityInput['kind'][] }>> {
  const cfg = config()
  const t = crsTransform(cfg.PROJECTED_EPSG)
  const rows = ids.length
    ? await Activity.findAll({
        where: { applicationId: { [Op.in]: [...ids] } },
        attributes: ['applicationId', 'position', 'input'],
        order: [
          ['applicationId', 'ASC'],
          ['position', 'ASC'],
        ],
        transaction,
      })
    : []
  const inputs = new Map<number, ActivityInput[]>()
  for (const r of rows) {
    const list = inputs.get(r.applicationId) ?? []
    list.push(parseJson<ActivityInput>(r.input))
    inputs.set(r.applicationId, list)
  }
  const out = new Map<number, { works: WorksOnSegment; kinds: ActivityInput['kind'][] }>()
  for (const [applicationId, list] of inputs) {
    const activities = toGridActivities(list, t)
    out.set(applicationId, {
      works: {
        applicationId,
        activities,
        influence_m: activities.map((g) =>
          gridActivityInfluence_m(g, cfg.SCREENING_MIN_DISTANCE_M),
        ),
      },
      kinds: list.map((a) => a.kind),
    })
  }
  return out
}

/**
 * Re-screen the combined results touched by a change to one application (submitted, granted,
 * varied or extended, withdrawn, refused, revoked), inside the caller's transaction.
 *
 * Only the segments the changed application affects are touched (found through its assessment
 * rows, which stay in place after a withdrawal or revocation); on each of them every live
 * application with an assessment there is recomputed — the changed one itself on all its
 * segments, the others only on the shared ones. "Reaches the segment" is the screening rule
 * itself: an application has an assessment row for a segment exactly when one of its
 * activities lies within its influence distance of it.
 *
 * A granted permit whose counted verdict gets worse is reported to the permit office and the
 * owner's engineers by mail, in the same transaction.
 *
 * Concurrency: the segments are locked (by id) before the other applications' rows are read,
 * and the caller's transaction is a `screeningTransaction` (READ COMMITTED), so two changes
 * beside the same pipe re-screen one after the other and the later one sees the earlier.
 */
export async function rescreenCombined(
  sequelize: Sequelize,
  changedApplicationId: number,
  transaction: Transaction,
  now = new Date(),
): Promise<RescreenSummary> {
  const today = isoToday(now)
  const own = await Assessment.findAll({
    where: { applicationId: changedApplicationId },
    attributes: ['pipeSegmentId'],
    transaction,
  })
  const segmentIds = [...new Set(own.map((r) => r.pipeSegmentId))]
  if (!segmentIds.length) return { segments: 0, pairs: 0, worsened: [] }
  await lockSegments(sequelize, segmentIds, transaction)

  // Which applications touch these segments comes from the (segment, application) index
  // alone; only the live ones' rows (with their engine input) are loaded. The segments'
  // assessments of withdrawn, refused and finished works pile up over the years.
  const touching = await sequelize.query<{ applicationId: number }>(
    'SELECT DISTINCT application_id AS applicationId FROM assessments WHERE pipe_segment_id IN (?)',
    { replacements: [segmentIds], type: QueryTypes.SELECT, transaction },
  )
  const live = await liveWorks(
    touching.map((r) => Number(r.applicationId)),
    today,
    transaction,
  )
  const liveRows = live.size
    ? await Assessment.findAll({
        where: {
          pipeSegmentId: { [Op.in]: segmentIds },
          applicationId: { [Op.in]: [...live.keys()] },
        },
        order: [['id', 'ASC']],
        transaction,
      })
    : []
  if (!liveRows.length) return { segments: segmentIds.length, pairs: 0, worsened: [] }
  const works = await worksOf([...new Set(liveRows.map((r) => r.applicationId))], transaction)
  const pieces = await segmentPieces(sequelize, segmentIds, transaction)

  const bySegment = new Map<number, Assessment[]>()
  for (const r of liveRows) {
    const list = bySegment.get(r.pipeSegmentId) ?? []
    list.push(r)
    bySegment.set(r.pipeSegmentId, list)
  }

  const worsened: CombinedWorsening[] = []
  const summaries = new Map<number, ConcurrentWorksSummary>()
  const summary = (id: number): ConcurrentWorksSummary => {
    let s = summaries.get(id)
    if (!s) {
      const w = live.get(id)!
      s = {
        applicationId: id,
        reference: w.reference,
        from: w.from,
        to: w.to,
        activityKinds: [...new Set(works.get(id)?.kinds ?? [])],
      }
      summaries.set(id, s)
    }
    return s
  }

  let pairs = 0
  for (const [segmentId, onSegment] of bySegment) {
    for (const row of onSegment) {
      const mine = live.get(row.applicationId)!
      const ownWorks = works.get(row.applicationId)
      if (!ownWorks) continue
      const others = onSegment
        .filter((o) => o.applicationId !== row.applicationId)
        .map((o) => live.get(o.applicationId)!)
        .filter((o) => rangesOverlap(mine, o))
      pairs++
      const combined = others.length
        ? worstCombinedScreening(
            parseJson<AssessmentInput>(row.engineInput).pipe,
            pieces.get(segmentId) ?? [],
            ownWorks.works,
            others.map((o) => works.get(o.applicationId)?.works).filter((w) => w !== undefined),
            concurrencyIntervals(
              mine,
              others.map((o: LiveWorks) => ({ id: o.applicationId, from: o.from, to: o.to })),
            ),
          )
        : null
      const before = effectiveVerdict({
        verdict: row.verdict,
        combinedVerdict: row.combinedVerdict,
      })
      const stored: StoredCombinedScreening | null = combined
        ? {
            screenedAt: now.toISOString(),
            worst: combined.worst,
            runs: combined.runs,
            applications: [...new Set(combined.runs.flatMap((r) => r.applicationIds))]
              .sort((a, b) => a - b)
              .map(summary),
            engineInput: combined.input,
            result: combined.result,
          }
        : null
      await row.update(
        { combinedVerdict: combined?.result.verdict ?? null, combined: stored },
        { transaction },
      )
      const after = effectiveVerdict({ verdict: row.verdict, combinedVerdict: row.combinedVerdict })
      if (
        row.applicationId !== changedApplicationId &&
        mine.status === 'granted' &&
        VERDICT_RANK[after] > VERDICT_RANK[before]
      ) {
        worsened.push({
          applicationId: row.applicationId,
          assessmentId: row.id,
          verdictBefore: before,
          verdictNow: after,
        })
        await mailWorsening(row, mine, stored!, before, after, transaction)
      }
    }
  }
  return { segments: segmentIds.length, pairs, worsened }
}

async function mailWorsening(
  row: Assessment,
  works: LiveWorks,
  stored: StoredCombinedScreening,
  before: Verdict,
  after: Verdict,
  transaction: Transaction,
): Promise<void> {
  const owner = await Organisation.findByPk(row.ownerOrganisationId, {
    attributes: ['name'],
    transaction,
  })
  const to = [
    ...new Set([
      ...(await roleEmails('permit_officer', transaction)),
      ...(await organisationEmails(row.ownerOrganisationId, 'asset_engineer', transaction)),
    ]),
  ]
  if (!to.length) return
  const withWorks = stored.applications.filter((a) =>
    stored.worst.applicationIds.includes(a.applicationId),
  )
  const mail = combinedWorsenedMail({
    publicUrl: config().publicUrl,
    applicationId: works.applicationId,
    reference: works.reference,
    ownerName: owner?.name ?? 'the owner',
    statement: combinedStatementText(
      row.medium,
      row.verdict,
      after,
      stored.worst.from,
      stored.worst.to,
      withWorks,
    ),
    verdictBefore: before,
    verdictNow: after,
  })
  // One mail per person: recipients do not see each other's addresses.
  for (const address of to) {
    await enqueueMail(
      { to: [address], ...mail, related: { type: 'application', id: works.applicationId } },
      transaction,
    )
  }
}
