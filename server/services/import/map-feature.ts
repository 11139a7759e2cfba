import type { CrsTransform } from '../../../shared/geo/crs.ts'
import {
  findSelfIntersection,
  polylineLength,
  withoutRepeatedPositions,
} from '../../../shared/geo/line-checks.ts'
import type { ImportMapping, MappableField } from '../../../shared/schemas/import-mapping.ts'
import { MAPPABLE_FIELDS } from '../../../shared/schemas/import-mapping.ts'
import {
  NUMERIC_SEGMENT_FIELDS,
  parsePipeSegmentData,
} from '../../../shared/schemas/pipe-segment.ts'
import type { FeatureIssue, PipeMedium, PipeSegmentData } from '../../../shared/types/network.ts'
import { PIPE_MEDIA } from '../../../shared/types/network.ts'
import type { SourceFeature } from './source-feature.ts'

/** A feature that passed every check, ready to be written. */
export interface MappedSegment {
  data: PipeSegmentData
  /** Vertices in the projected CRS, metres, rounded to the millimetre. */
  grid: [number, number][]
  length_m: number
}

export type MapResult =
  | { ok: true; segment: MappedSegment }
  | { ok: false; ownerRef: string | null; issues: FeatureIssue[] }

/** What mapping needs besides the feature. */
export interface MapContext {
  mapping: ImportMapping
  /** Whether attribute values are text to be read as numbers (CSV) or typed JSON (GeoJSON). */
  textValues: boolean
  /** The owner organisation's medium, used when neither feature nor mapping names one. */
  ownerMedium: PipeMedium | null
  /** Service area, [minLon, minLat, maxLon, maxLat]. */
  serviceArea: readonly [number, number, number, number]
  crs: CrsTransform
}

/** Shortest segment length accepted, m: anything shorter is a digitising slip, not a pipe. */
export const MIN_SEGMENT_LENGTH_M = 0.01
/** Vertices closer than this (m) are one vertex. */
const REPEAT_TOLERANCE_M = 0.001
const MM = 1000
const PRESSURE_KPA_PER: Record<ImportMapping['pressureUnit'], number> = {
  kPa: 1,
  bar: 100,
  MPa: 1000,
}
const NUMERIC = new Set<string>(NUMERIC_SEGMENT_FIELDS)

const describe = (v: unknown) =>
  typeof v === 'string'
    ? `the text "${v.slice(0, 40)}"`
    : v === null
      ? 'null'
      : Array.isArray(v)
        ? 'an array'
        : `a ${typeof v}`

/**
 * Turns one source feature into a segment: reads each field from its mapped attribute (or the
 * attribute of the field's own name), converts units, validates with the shared segment schema
 * and checks the line (a LineString, inside the service area, a real length, not crossing
 * itself). Every problem names the feature and the field, and the source attribute when it differs.
 */
export function mapFeature(f: SourceFeature, ctx: MapContext): MapResult {
  const { mapping } = ctx
  const props = f.properties ?? {}
  const issues: FeatureIssue[] = []
  const sourceOf = (field: MappableField) => mapping.fields[field] ?? field
  const label = (field: MappableField) =>
    sourceOf(field) === field ? '' : ` (attribute "${sourceOf(field)}")`

  const rawRef = props[sourceOf('ownerRef')] ?? f.id
  const ownerRef =
    typeof rawRef === 'string' ? rawRef.trim() : typeof rawRef === 'number' ? String(rawRef) : null
  const issue = (field: string, message: string) =>
    issues.push({ index: f.index, ownerRef: ownerRef || null, field, message })

  for (const s of f.structureIssues) issue(s.path || 'feature', s.message)

  const raw: Record<string, unknown> = {}
  for (const field of MAPPABLE_FIELDS) {
    let v = props[sourceOf(field)]
    if (field === 'ownerRef') v = ownerRef ?? undefined
    if (v === undefined || v === null || (typeof v === 'string' && v.trim() === '')) continue
    if (NUMERIC.has(field)) {
      let n: number
      if (typeof v === 'number') n = v
      else if (typeof v === 'string' && ctx.textValues) {
        const text = mapping.csv.decimalComma
          ? v.trim().replace(/\./g, '').replace(',', '.')
          : v.trim()
        n = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/.test(text) ? Number(text) : NaN
        if (Number.isNaN(n)) {
          issue(field, `Expected a number${label(field)}, got ${describe(v)}`)
          continue
        }
      } else {
        issue(field, `Expected a number${label(field)}, got ${describe(v)}`)
        continue
      }
      if (field === 'outerDiameter_m' && mapping.diameterUnit === 'mm') n /= MM
      if (field === 'wallThickness_m' && mapping.wallThicknessUnit === 'mm') n /= MM
      if (field === 'internalPressure_kPa') n *= PRESSURE_KPA_PER[mapping.pressureUnit]
      raw[field] = n
    } else if (typeof v === 'string' || typeof v === 'number') {
      let s = String(v).trim()
      if (field === 'material') s = mapping.materialValues[s] ?? s
      if (field === 'medium') s = mapping.mediumValues[s] ?? s
      raw[field] = s
    } else {
      issue(field, `Expected text${label(field)}, got ${describe(v)}`)
    }
  }
  if (raw.medium === undefined) {
    const fallback = mapping.defaultMedium ?? ctx.ownerMedium
    if (fallback && (PIPE_MEDIA as readonly string[]).includes(fallback)) raw.medium = fallback
  }
  if (raw.positionalQuality === undefined) raw.positionalQuality = 'unknown'

  const parsed = parsePipeSegmentData(raw)
  if (!parsed.ok) {
    for (const i of parsed.issues) {
      if (issues.some((x) => x.field === i.field)) continue
      const f0 = i.field as MappableField
      if (!(MAPPABLE_FIELDS as readonly string[]).includes(f0)) {
        issue(i.field, i.message)
        continue
      }
      // A missing value gets "Required" whatever the field schema's wording for a bad one.
      const message =
        raw[f0] === undefined && !i.message.startsWith('Required') ? 'Required' : i.message
      issue(i.field, `${message}${label(f0)}`)
    }
  }

  const grid = issues.some((i) => i.field.startsWith('geometry') || i.field === 'feature')
    ? null
    : checkLine(f.geometry, ctx, issue)
  if (issues.length || !parsed.ok || !grid) return { ok: false, ownerRef: ownerRef || null, issues }
  return { ok: true, segment: { data: parsed.data, grid, length_m: polylineLength(grid) } }
}

/**
 * The line checks of an import, also used by the edit: a LineString (or a one-part
 * MultiLineString), every vertex inside the service area, a real length, not crossing itself.
 * Returns the projected vertices, or null after reporting the problem through `issue`.
 */
export function checkLine(
  geometry: unknown,
  ctx: Pick<MapContext, 'serviceArea' | 'crs'>,
  issue: (field: string, message: string) => void,
): [number, number][] | null {
  if (geometry === null || geometry === undefined) {
    issue('geometry', 'A pipe segment needs a geometry (a LineString)')
    return null
  }
  const g = geometry as { type: string; coordinates: number[][] | number[][][] }
  let coords: number[][]
  if (g.type === 'LineString') coords = g.coordinates as number[][]
  else if (g.type === 'MultiLineString' && (g.coordinates as number[][][]).length === 1)
    coords = (g.coordinates as number[][][])[0]!
  else {
    issue(
      'geometry.type',
      g.type === 'MultiLineString'
        ? 'A pipe segment is one line: split this MultiLineString into one feature per part'
        : `A pipe segment must be a LineString, got a ${g.type} (points and areas are not pipes)`,
    )
    return null
  }
  const [minLon, minLat, maxLon, maxLat] = ctx.serviceArea
  const outside = coords.findIndex(
    (p) => p[0]! < minLon || p[0]! > maxLon || p[1]! < minLat || p[1]! > maxLat,
  )
  if (outside >= 0) {
    const p = coords[outside]!
    issue(
      `geometry.coordinates.${outside}`,
      `The position ${p[0]}, ${p[1]} lies outside the service area (lon ${minLon}..${maxLon}, lat ${minLat}..${maxLat}); are longitude and latitude swapped?`,
    )
    return null
  }
  const grid = withoutRepeatedPositions(
    coords.map((p) => {
      const [x, y] = ctx.crs.toGrid(p)
      return [Math.round(x * MM) / MM, Math.round(y * MM) / MM] as [number, number]
    }),
    REPEAT_TOLERANCE_M,
  )
  const length_m = polylineLength(grid)
  if (grid.length < 2 || length_m < MIN_SEGMENT_LENGTH_M) {
    issue(
      'geometry',
      `The line has zero length (under ${MIN_SEGMENT_LENGTH_M * 100} cm between its ends)`,
    )
    return null
  }
  const crossing = findSelfIntersection(grid)
  if (crossing) {
    issue(
      'geometry',
      `The line crosses or touches itself (pieces ${crossing.pieceA + 1} and ${crossing.pieceB + 1})`,
    )
    return null
  }
  return grid
}
