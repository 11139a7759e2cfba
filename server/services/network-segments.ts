import { Op, QueryTypes, UniqueConstraintError } from 'sequelize'
import type { Sequelize, WhereOptions } from 'sequelize'
import { crsTransform } from '../../shared/geo/crs.ts'
import { geometryIssues } from '../../shared/geo/geojson-structure.ts'
import { polylineLength } from '../../shared/geo/line-checks.ts'
import type { SegmentListQuery } from '../../shared/schemas/network-query.ts'
import { parsePipeSegmentData } from '../../shared/schemas/pipe-segment.ts'
import type { PipeSegmentEdit } from '../../shared/schemas/pipe-segment.ts'
import type { FieldIssue } from '../../shared/errors.ts'
import type {
  LineStringLonLat,
  PipeSegmentData,
  PipeSegmentDto,
  PipeSegmentPage,
  PipeSegmentSummaryDto,
} from '../../shared/types/network.ts'
import type { AppConfig } from '../config.ts'
import { conflict, notFound, validationFailed } from '../errors.ts'
import { Organisation, PipeSegment } from '../models/index.ts'
import type { User } from '../models/user.ts'
import { recordAudit } from './audit.ts'
import { checkLine } from './import/map-feature.ts'
import { scopeCovers, segmentReadScope, segmentWriteOwner } from './network-access.ts'
import { baselineDto, computeBaseline } from './pipe-baseline.ts'
import type { StoredBaseline } from './pipe-baseline.ts'
import { SEGMENT_DATA_COLUMNS, SEGMENT_DATA_FIELDS, gridLineWkt } from './segment-columns.ts'

const SORT_COLUMNS: Record<SegmentListQuery['sort'], string> = {
  ownerRef: 'ownerRef',
  medium: 'medium',
  material: 'material',
  outerDiameter_m: 'outerDiameter_m',
  yearLaid: 'yearLaid',
  length_m: 'length_m',
  baselineUtilisation: 'baselineUtilisation',
  updatedAt: 'updatedAt',
}

/** The design data of a stored segment. */
export function segmentData(s: PipeSegment): PipeSegmentData {
  const out = {} as Record<string, unknown>
  for (const f of SEGMENT_DATA_FIELDS) out[f] = s[f]
  return out as unknown as PipeSegmentData
}

function summaryDto(s: PipeSegment): PipeSegmentSummaryDto {
  return {
    id: Number(s.id),
    ownerRef: s.ownerRef,
    medium: s.medium,
    material: s.material,
    outerDiameter_m: s.outerDiameter_m,
    coverMin_m: Math.min(s.coverStart_m, s.coverEnd_m),
    yearLaid: s.yearLaid,
    length_m: s.length_m,
    baselineVerdict: s.baselineVerdict,
    baselineGoverningCheck: s.baselineGoverningCheck,
    baselineUtilisation: s.baselineUtilisation,
    baselineOverCapacity: Boolean(s.baselineOverCapacity),
    version: s.version,
    updatedAt: s.updatedAt.toISOString(),
  }
}

const escapeLike = (q: string) => q.replace(/[\\%_]/g, (c) => `\\${c}`)

/**
 * A page of segments the user may read: an engineer's own organisation's, or (admin) any
 * owner's, optionally one owner's. Filters and sorting run in the database.
 */
export async function listSegments(user: User, q: SegmentListQuery): Promise<PipeSegmentPage> {
  const scope = segmentReadScope(user)
  const where: WhereOptions<PipeSegment> & Record<string, unknown> = {}
  if (scope.kind === 'owner') where.ownerOrganisationId = scope.organisationId
  else if (q.ownerId) where.ownerOrganisationId = q.ownerId
  if (q.medium) where.medium = q.medium
  if (q.material) where.material = q.material
  if (q.overCapacity !== undefined) where.baselineOverCapacity = q.overCapacity
  if (q.q) where.ownerRef = { [Op.like]: `%${escapeLike(q.q)}%` }
  const { rows, count } = await PipeSegment.findAndCountAll({
    where,
    order: [
      [SORT_COLUMNS[q.sort], q.order.toUpperCase()],
      ['id', 'ASC'],
    ],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  })
  return { items: rows.map(summaryDto), total: count, page: q.page, pageSize: q.pageSize }
}

async function lineOf(sequelize: Sequelize, id: number, epsg: number): Promise<LineStringLonLat> {
  const [row] = await sequelize.query<{ g: string | { coordinates: number[][] } }>(
    'SELECT ST_AsGeoJSON(geom) AS g FROM pipe_segments WHERE id = ?',
    {
      replacements: [id],
      type: QueryTypes.SELECT,
    },
  )
  const g =
    typeof row!.g === 'string' ? (JSON.parse(row!.g) as { coordinates: number[][] }) : row!.g
  return gridToLonLat(g.coordinates, epsg)
}

/** A projected line as a WGS84 LineString, positions rounded to 1e-8° (about 1 mm). */
export function gridToLonLat(coords: number[][], epsg: number): LineStringLonLat {
  const t = crsTransform(epsg)
  const r = (v: number) => Math.round(v * 1e8) / 1e8
  return {
    type: 'LineString',
    coordinates: coords
      .map((c) => t.toLonLat(c))
      .map(([lon, lat]) => [r(lon), r(lat)] as [number, number]),
  }
}

async function toDto(sequelize: Sequelize, s: PipeSegment, epsg: number): Promise<PipeSegmentDto> {
  const owner = await Organisation.findByPk(s.ownerOrganisationId)
  const data = segmentData(s)
  return {
    id: Number(s.id),
    owner: { id: s.ownerOrganisationId, name: owner?.name ?? '' },
    ...data,
    geometry: await lineOf(sequelize, Number(s.id), epsg),
    length_m: s.length_m,
    baseline: baselineDto(data, {
      verdict: s.baselineVerdict,
      governingCheck: s.baselineGoverningCheck,
      utilisation: s.baselineUtilisation,
      overCapacity: Boolean(s.baselineOverCapacity),
      result: s.baselineResult as StoredBaseline | null,
      engineVersion: s.baselineEngineVersion,
      error: s.baselineError,
    }),
    lastImportId: s.lastImportId === null ? null : Number(s.lastImportId),
    version: s.version,
    createdAt: s.createdAt.toISOString(),
    updatedAt: s.updatedAt.toISOString(),
  }
}

/** One segment with all its data; 404 when it does not exist or the user may not read it. */
export async function getSegment(
  user: User,
  id: number,
  sequelize: Sequelize,
  cfg: AppConfig,
): Promise<PipeSegmentDto> {
  const scope = segmentReadScope(user)
  const s = await PipeSegment.findByPk(id)
  if (!s || !scopeCovers(scope, s.ownerOrganisationId)) throw notFound('pipe segment', id)
  return toDto(sequelize, s, cfg.PROJECTED_EPSG)
}

/**
 * Edit one of the owner's segments. The merged data pass the same validation as an import
 * (shared schema, line checks); the baseline is recomputed; the update applies only if the
 * version is still the one the client read (else 409), and bumps it. Audited with the changes.
 */
export async function updateSegment(
  user: User,
  id: number,
  edit: PipeSegmentEdit,
  sequelize: Sequelize,
  cfg: AppConfig,
): Promise<PipeSegmentDto> {
  const owner = segmentWriteOwner(user)
  const s = await PipeSegment.findByPk(id)
  if (!s || s.ownerOrganisationId !== owner) throw notFound('pipe segment', id)
  const stale = () =>
    conflict(
      `The segment was changed by someone else (now version ${s.version}); reload it and apply your change again`,
      [{ field: 'version', message: 'is out of date' }],
    )
  if (edit.version !== s.version) throw stale()

  const { version, geometry, ...fields } = edit
  const before = segmentData(s)
  const parsed = parsePipeSegmentData({ ...before, ...fields })
  if (!parsed.ok) throw validationFailed(parsed.issues)
  const data = parsed.data

  let grid: [number, number][] | null = null
  if (geometry) {
    const issues: FieldIssue[] = geometryIssues(geometry, 'geometry').map((i) => ({
      field: i.path,
      message: i.message,
    }))
    if (!issues.length) {
      grid = checkLine(
        geometry,
        { serviceArea: cfg.SERVICE_AREA_BBOX, crs: crsTransform(cfg.PROJECTED_EPSG) },
        (field, message) => issues.push({ field, message }),
      )
    }
    if (issues.length || !grid) throw validationFailed(issues)
  }

  const changed = SEGMENT_DATA_FIELDS.filter((f) => before[f] !== data[f])
  const b = computeBaseline(data)
  const sets = SEGMENT_DATA_FIELDS.map((f) => `${SEGMENT_DATA_COLUMNS[f]} = ?`)
  const values: unknown[] = SEGMENT_DATA_FIELDS.map((f) => data[f])
  sets.push(
    'baseline_verdict = ?',
    'baseline_governing_check = ?',
    'baseline_utilisation = ?',
    'baseline_over_capacity = ?',
    'baseline_result = ?',
    'baseline_engine_version = ?',
    'baseline_error = ?',
  )
  values.push(
    b.verdict,
    b.governingCheck,
    b.utilisation,
    b.overCapacity,
    b.result === null ? null : JSON.stringify(b.result),
    b.engineVersion,
    b.error,
  )
  if (grid) {
    sets.push(`geom = ST_GeomFromText(?, ${Number(cfg.PROJECTED_EPSG)})`, 'length_m = ?')
    values.push(gridLineWkt(grid), polylineLength(grid))
  }
  const t = await sequelize.transaction()
  try {
    const [, affected] = (await sequelize.query(
      `UPDATE pipe_segments SET ${sets.join(', ')}, version = version + 1, updated_at = ? WHERE id = ? AND version = ?`,
      {
        replacements: [...values, new Date(), id, version],
        type: QueryTypes.UPDATE,
        transaction: t,
      },
    )) as [unknown, number]
    if (affected !== 1) throw stale()
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'network.segment.updated',
        entityType: 'pipe_segment',
        entityId: id,
        details: {
          changes: Object.fromEntries(changed.map((f) => [f, { from: before[f], to: data[f] }])),
          geometryChanged: Boolean(grid),
          version: version + 1,
        },
      },
      t,
    )
    await t.commit()
  } catch (err) {
    await t.rollback()
    if (err instanceof UniqueConstraintError) {
      throw conflict(`The owner reference "${data.ownerRef}" is already used by another segment`, [
        { field: 'ownerRef', message: 'is already used' },
      ])
    }
    throw err
  }
  await s.reload()
  return toDto(sequelize, s, cfg.PROJECTED_EPSG)
}
