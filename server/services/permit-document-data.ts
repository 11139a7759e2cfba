import { QueryTypes } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import { formatVerificationCode } from '../../shared/schemas/verification.ts'
import { STANDARD_CAUTION } from '../../shared/statics/index.ts'
import type { CheckId } from '../../shared/statics/types.ts'
import { REVIEW_STATE_LABELS } from '../../shared/types/reviews.ts'
import { CHECK_LABELS, countedVerdict, VERDICT_RANK } from '../../shared/types/screening.ts'
import { config } from '../config.ts'
import type { GridXY, MapExtractData, MapWorks } from '../pdf/map-extract.ts'
import { mapBounds } from '../pdf/map-extract.ts'
import type { PermitDocumentData } from '../pdf/permit-pdf.ts'
import {
  Activity,
  Application,
  Assessment,
  Organisation,
  OwnerReview,
  User,
} from '../models/index.ts'
import type { Permit } from '../models/index.ts'
import { parseJson, storedConditions } from './review-dto.ts'

/** The public check page of a code. */
export const verificationUrl = (code: string) =>
  `${config().publicUrl.replace(/\/+$/, '')}/verify/${formatVerificationCode(code)}`

/** The key inputs of an activity in one plain line, units included. */
export function activityKeyInputs(a: ActivityInput): string {
  switch (a.kind) {
    case 'excavation':
      return `depth ${a.depth_m} m, support ${a.support.replace('-', ' ')}, digging ${a.digging.replace(/-/g, ' ')}`
    case 'crane':
      return (
        `${a.setup === 'outriggers' ? 'on outriggers' : 'on a single pad'}, largest leg load ` +
        `${a.legLoad_kN} kN, mats ${a.matLength_m} m × ${a.matWidth_m} m`
      )
    case 'fill':
      return `height ${a.height_m} m, unit weight ${a.unitWeight_kN_per_m3} kN/m³, on site ${a.duration_days} days`
  }
}

function matSquare(
  centre: GridXY,
  length_m: number,
  width_m: number,
  rotation_deg: number,
): GridXY[] {
  // Rotation is from grid north, clockwise: the long side points along (sin θ, cos θ).
  const t = (rotation_deg * Math.PI) / 180
  const along: GridXY = [Math.sin(t), Math.cos(t)]
  const across: GridXY = [Math.cos(t), -Math.sin(t)]
  const hl = length_m / 2
  const hw = width_m / 2
  return [
    [-1, -1],
    [1, -1],
    [1, 1],
    [-1, 1],
  ].map(([s, u]) => [
    centre[0] + along[0] * hl * u! + across[0] * hw * s!,
    centre[1] + along[1] * hl * u! + across[1] * hw * s!,
  ])
}

async function mapData(
  sequelize: Sequelize,
  applicationId: number,
  activities: readonly Activity[],
  segmentIds: readonly number[],
  mediumBySegment: ReadonlyMap<number, string>,
  transaction?: Transaction,
): Promise<MapExtractData> {
  const epsg = config().PROJECTED_EPSG
  const geoms = await sequelize.query<{ id: number; g: unknown }>(
    'SELECT id, ST_AsGeoJSON(geom) AS g FROM activities WHERE application_id = ?',
    { replacements: [applicationId], type: QueryTypes.SELECT, transaction },
  )
  const byId = new Map(
    geoms.map((r) => [Number(r.id), parseJson<{ type: string; coordinates: unknown }>(r.g)]),
  )
  const works: MapWorks[] = []
  for (const a of [...activities].sort((p, q) => p.position - q.position)) {
    const g = byId.get(a.id)
    if (!g) continue
    const input = parseJson<ActivityInput>(a.input)
    const label = a.label ?? `${a.kind} ${a.position + 1}`
    if (g.type === 'Polygon') {
      works.push({ label, kind: a.kind, rings: [(g.coordinates as GridXY[][])[0]!.slice(0, -1)] })
    } else if (input.kind === 'crane') {
      const points = g.type === 'Point' ? [g.coordinates as GridXY] : (g.coordinates as GridXY[])
      works.push({
        label,
        kind: a.kind,
        rings: points.map((p) =>
          matSquare(p, input.matLength_m, input.matWidth_m, input.matRotation_deg),
        ),
      })
    }
  }
  const pipes: MapExtractData['pipes'] = []
  if (segmentIds.length) {
    const rows = await sequelize.query<{ id: number; g: unknown }>(
      'SELECT id, ST_AsGeoJSON(geom) AS g FROM pipe_segments WHERE id IN (?)',
      { replacements: [segmentIds], type: QueryTypes.SELECT, transaction },
    )
    for (const r of rows) {
      pipes.push({
        medium: mediumBySegment.get(Number(r.id)) ?? 'other',
        line: parseJson<{ coordinates: GridXY[] }>(r.g).coordinates,
      })
    }
  }
  const b = mapBounds({ streets: [], works, pipes })
  // Widen the street search a little beyond the frame so streets reach its edges.
  const pad = (b.maxX - b.minX) * 0.5
  const frame = `POLYGON((${b.minX - pad} ${b.minY - pad}, ${b.maxX + pad} ${b.minY - pad}, ${b.maxX + pad} ${b.maxY + pad}, ${b.minX - pad} ${b.maxY + pad}, ${b.minX - pad} ${b.minY - pad}))`
  const streets = await sequelize.query<{ name: string; g: unknown }>(
    'SELECT name, ST_AsGeoJSON(geom) AS g FROM streets WHERE MBRIntersects(geom, ST_GeomFromText(?, ?)) LIMIT 500',
    { replacements: [frame, epsg], type: QueryTypes.SELECT, transaction },
  )
  return {
    works,
    pipes,
    streets: streets.map((s) => ({
      name: s.name,
      line: parseJson<{ coordinates: GridXY[] }>(s.g).coordinates,
    })),
  }
}

/**
 * Gather what the permit document of one permit issue shows: parties, site, validity, the
 * works and affected pipes for the map, every activity's key inputs, every affected owner's
 * decision and conditions, the screening summary and the caution.
 */
export async function permitDocumentData(
  sequelize: Sequelize,
  permit: Permit,
  certificateSha256: string,
  transaction?: Transaction,
): Promise<PermitDocumentData> {
  const a = await Application.findByPk(permit.applicationId, {
    include: [
      { model: Activity, as: 'activities' },
      { model: Organisation, as: 'applicantOrganisation', attributes: ['id', 'name'] },
    ],
    transaction,
  })
  if (!a) throw new Error(`application ${permit.applicationId} is missing`)
  const issuer = await User.findByPk(permit.issuedByUserId, {
    include: [{ model: Organisation, as: 'organisation', attributes: ['name'] }],
    transaction,
  })
  const reviews = await OwnerReview.findAll({
    where: { applicationId: a.id },
    include: [{ model: Organisation, as: 'owner', attributes: ['id', 'name'] }],
    order: [['id', 'ASC']],
    transaction,
  })
  const deciders = await User.findAll({
    where: { id: reviews.map((r) => r.decidedByUserId).filter((x): x is number => x !== null) },
    attributes: ['id', 'name'],
    transaction,
  })
  const deciderName = new Map(deciders.map((u) => [u.id, u.name]))
  const assessments = await Assessment.findAll({ where: { applicationId: a.id }, transaction })
  const ownerName = new Map(reviews.map((r) => [r.ownerOrganisationId, r.owner?.name ?? '']))

  const screening = new Map<number, PermitDocumentData['screening'][number] & { rank: number }>()
  for (const s of assessments) {
    const prev = screening.get(s.ownerOrganisationId)
    // The verdict that counts: the works alone or together with other works at the same time.
    const verdict = countedVerdict(
      s.verdict,
      s.combinedVerdict ? { verdictCombined: s.combinedVerdict } : null,
    )
    const rank = VERDICT_RANK[verdict]
    const here = {
      ownerName: ownerName.get(s.ownerOrganisationId) ?? '',
      segmentCount: (prev?.segmentCount ?? 0) + 1,
      worstVerdict: verdict,
      governingCheck: s.governingCheck
        ? (CHECK_LABELS[s.governingCheck as CheckId] ?? s.governingCheck)
        : null,
      utilisationWithWorks: s.utilisationWithWorks,
      rank,
    }
    if (!prev) screening.set(s.ownerOrganisationId, here)
    else {
      prev.segmentCount++
      if (
        rank > prev.rank ||
        (rank === prev.rank && (s.utilisationWithWorks ?? 0) > (prev.utilisationWithWorks ?? 0))
      ) {
        screening.set(s.ownerOrganisationId, { ...here, segmentCount: prev.segmentCount })
      }
    }
  }

  const affected = reviews.filter((r) => r.state !== 'not_affected')
  return {
    permitNumber: permit.number,
    issue: permit.issue,
    changeKind: permit.changeKind,
    changeReason: permit.changeReason,
    validFrom: permit.validFrom,
    validTo: permit.validTo,
    issuedAt: permit.issuedAt,
    verificationCode: formatVerificationCode(permit.verificationCode),
    verificationUrl: verificationUrl(permit.verificationCode),
    application: {
      reference: a.reference ?? `#${a.id}`,
      title: a.title,
      siteAddress: a.siteAddress,
      startsOn: a.startsOn,
      endsOn: a.endsOn,
      description: a.description,
    },
    applicant: {
      organisation: a.applicantOrganisation?.name ?? '',
      contactName: a.contactName,
      contactPhone: a.contactPhone,
    },
    issuer: {
      name: issuer?.name ?? '',
      organisation: issuer?.organisation?.name ?? 'Permit office',
    },
    activities: [...(a.activities ?? [])]
      .sort((p, q) => p.position - q.position)
      .map((x) => {
        const input = parseJson<ActivityInput>(x.input)
        return {
          label: x.label ?? `${x.kind} ${x.position + 1}`,
          kind: x.kind,
          keyInputs: activityKeyInputs(input),
        }
      }),
    conditions: parseJson<Permit['conditions']>(permit.conditions).map((c) => ({
      text: c.text,
      ownerName: c.ownerName,
    })),
    owners: affected.map((r) => ({
      name: r.owner?.name ?? '',
      decision: REVIEW_STATE_LABELS[r.state],
      decidedBy: r.decidedByUserId ? (deciderName.get(r.decidedByUserId) ?? null) : null,
      decidedAt: r.decidedAt,
      reasons: r.reasons,
      conditions: storedConditions(r.conditions).map((c) => c.text),
    })),
    notAffectedOwnerCount: reviews.length - affected.length,
    screening: [...screening.values()].map(({ rank: _rank, ...s }) => s),
    map: await mapData(
      sequelize,
      a.id,
      a.activities ?? [],
      assessments.map((s) => s.pipeSegmentId),
      new Map(assessments.map((s) => [s.pipeSegmentId, s.medium])),
      transaction,
    ),
    caution: STANDARD_CAUTION,
    certificateSha256,
  }
}
