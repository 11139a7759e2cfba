import { Op } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import { pieceToRingDistance_m, pipePieces } from '../../shared/geo/pipe-local-frame.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import {
  gridActivityInfluence_m,
  toGridActivities,
  toPieceActivities,
} from '../../shared/screening/engine-activities.ts'
import type { GridActivity } from '../../shared/screening/engine-activities.ts'
import { assessPipe } from '../../shared/statics/index.ts'
import type { AssessmentInput, AssessmentResult, Verdict } from '../../shared/statics/types.ts'
import { VERDICT_RANK } from '../../shared/types/screening.ts'
import { config } from '../config.ts'
import { Assessment, PipeSegment } from '../models/index.ts'
import { segmentData } from './network-segments.ts'
import { pipeEngineInput } from './pipe-engine-input.ts'
import { BASELINE_ENGINE_VERSION } from './pipe-baseline.ts'
import { lockSegments } from './segment-locks.ts'
import { findSegmentsNear } from './spatial-query.ts'

/** One segment's screening outcome before it is stored. */
export interface SegmentScreening {
  segmentId: number
  ownerOrganisationId: number
  medium: string
  distance_m: number
  pieceIndex: number
  input: AssessmentInput
  result: AssessmentResult
}

export interface ActivityReach {
  activityId: string
  sourceIndex: number
  influence_m: number
}

const worse = (a: AssessmentResult, b: AssessmentResult): boolean => {
  const ra = VERDICT_RANK[a.verdict]
  const rb = VERDICT_RANK[b.verdict]
  if (ra !== rb) return ra > rb
  return maxUtilisation(a) > maxUtilisation(b)
}

const maxUtilisation = (r: AssessmentResult) =>
  r.checks.reduce((m, c) => Math.max(m, c.withWorks.utilisation), 0)

/**
 * Screen a set of drawn activities against the stored network: find every segment within an
 * activity's influence distance (spatial index, then exact distances), and run the engine on
 * each straight piece of it that some activity reaches, with ALL the activities in that piece's
 * frame. The worst piece stands for the segment. Pure reads; the caller stores the results.
 *
 * Project rule: the engine treats a piece as a straight pipe of unlimited length. Loads beyond
 * a piece's end are therefore checked as if the pipe went on — conservative, and the next piece
 * of a bent segment is checked in its own frame.
 */
export async function screenActivities(
  sequelize: Sequelize,
  activities: readonly ActivityInput[],
): Promise<{ segments: SegmentScreening[]; reach: ActivityReach[] }> {
  const cfg = config()
  const t = crsTransform(cfg.PROJECTED_EPSG)
  const grid = toGridActivities(activities, t)
  const reach = grid.map((g) => ({
    activityId: g.id,
    sourceIndex: g.sourceIndex,
    influence_m: gridActivityInfluence_m(g, cfg.SCREENING_MIN_DISTANCE_M),
  }))

  const nearby = new Map<number, { distance_m: number; grid: [number, number][] }>()
  for (const [i, g] of grid.entries()) {
    const found = await findSegmentsNear(
      sequelize,
      cfg.PROJECTED_EPSG,
      { type: 'Polygon', rings: [[...g.ring_grid, g.ring_grid[0]!]] },
      reach[i]!.influence_m,
    )
    for (const s of found) {
      const prev = nearby.get(s.id)
      if (!prev || s.distance_m < prev.distance_m)
        nearby.set(s.id, { distance_m: s.distance_m, grid: s.grid })
    }
  }
  if (nearby.size === 0) return { segments: [], reach }

  const rows = await PipeSegment.findAll({ where: { id: { [Op.in]: [...nearby.keys()] } } })
  const segments: SegmentScreening[] = []
  for (const row of rows) {
    const near = nearby.get(Number(row.id))!
    const pipe = pipeEngineInput(segmentData(row))
    let best: SegmentScreening | undefined
    for (const piece of pipePieces(near.grid)) {
      const reached = grid.some(
        (g: GridActivity, i) => pieceToRingDistance_m(piece, g.ring_grid) <= reach[i]!.influence_m,
      )
      if (!reached) continue
      const input: AssessmentInput = { pipe, activities: toPieceActivities(grid, piece) }
      const result = assessPipe(input)
      if (!best || worse(result, best.result)) {
        best = {
          segmentId: Number(row.id),
          ownerOrganisationId: row.ownerOrganisationId,
          medium: row.medium,
          distance_m: near.distance_m,
          pieceIndex: piece.index,
          input,
          result,
        }
      }
    }
    if (best) segments.push(best)
  }
  return { segments: segments.sort((a, b) => a.segmentId - b.segmentId), reach }
}

/**
 * Screen a submitted application and store one Assessment per affected segment (replacing any
 * earlier screening of it), inside the caller's transaction (a `screeningTransaction`).
 *
 * Before it writes, it locks every segment it affects and every segment of its earlier
 * assessments (by id), and holds them until commit: another submission beside the same pipe
 * waits, then its combined screening sees this one.
 */
export async function screenApplication(
  sequelize: Sequelize,
  applicationId: number,
  activities: readonly ActivityInput[],
  transaction: Transaction,
): Promise<{ affected: number; worst: Verdict | 'not-affected' }> {
  const { segments } = await screenActivities(sequelize, activities)
  const earlier = await Assessment.findAll({
    where: { applicationId },
    attributes: ['pipeSegmentId'],
    transaction,
  })
  await lockSegments(
    sequelize,
    [...segments.map((s) => s.segmentId), ...earlier.map((r) => r.pipeSegmentId)],
    transaction,
  )
  await Assessment.destroy({ where: { applicationId }, transaction })
  let worst: Verdict | 'not-affected' = 'not-affected'
  // One multi-row INSERT for all affected segments.
  await Assessment.bulkCreate(
    segments.map((s) => {
      const governing = s.result.checks.find((c) => c.governing) ?? null
      if (VERDICT_RANK[s.result.verdict] > VERDICT_RANK[worst]) worst = s.result.verdict
      return {
        applicationId,
        pipeSegmentId: s.segmentId,
        ownerOrganisationId: s.ownerOrganisationId,
        medium: s.medium,
        verdict: s.result.verdict,
        governingCheck: governing?.id ?? null,
        utilisationBaseline: governing?.baseline.utilisation ?? null,
        utilisationWithWorks: governing?.withWorks.utilisation ?? null,
        distance_m: s.distance_m,
        pieceIndex: s.pieceIndex,
        engineInput: s.input,
        result: s.result,
        engineVersion: BASELINE_ENGINE_VERSION,
      }
    }),
    { transaction },
  )
  return { affected: segments.length, worst }
}
