/**
 * What the network API returns: pipe segments, import jobs, the screening outline. Geometry is
 * GeoJSON in WGS84 (RFC 7946, [lon, lat]); quantities carry their unit in the name.
 */
import type { FieldIssue } from '../errors.ts'
import type { ImportMapping } from '../schemas/import-mapping.ts'
import type { Installation, PipeMaterial, Verdict } from '../statics/types.ts'

/** What a pipe carries. */
export const PIPE_MEDIA = ['water', 'sewer', 'gas', 'district_heating', 'other'] as const
export type PipeMedium = (typeof PIPE_MEDIA)[number]

/** Plain-word labels shown in the client. */
export const PIPE_MEDIUM_LABELS: Record<PipeMedium, string> = {
  water: 'Water',
  sewer: 'Sewer',
  gas: 'Gas',
  district_heating: 'District heating',
  other: 'Other',
}

/** How the position of a segment was captured (our own classes, best first). */
export const POSITIONAL_QUALITIES = ['surveyed', 'digitised', 'estimated', 'unknown'] as const
export type PositionalQuality = (typeof POSITIONAL_QUALITIES)[number]

export const IMPORT_FORMATS = ['geojson', 'csv'] as const
export type ImportFormat = (typeof IMPORT_FORMATS)[number]

/**
 * Life of an import job: uploaded -> validating -> validated (features checked; commit may
 * follow) or rejected (the file itself is unusable) -> committing -> committed, or failed (an
 * unexpected error in a pass; nothing was written).
 */
export const IMPORT_STATUSES = [
  'uploaded',
  'validating',
  'validated',
  'rejected',
  'committing',
  'committed',
  'failed',
] as const
export type ImportStatus = (typeof IMPORT_STATUSES)[number]

export interface LineStringLonLat {
  type: 'LineString'
  coordinates: [number, number][]
}

/** One problem with one feature of an import file. `index` counts features from 0. */
export interface FeatureIssue {
  index: number
  ownerRef: string | null
  field: string
  message: string
}

/** The stored design data of a segment (the fields an import or edit sets). */
export interface PipeSegmentData {
  ownerRef: string
  medium: PipeMedium
  material: PipeMaterial
  outerDiameter_m: number
  wallThickness_m: number
  shortTermModulus_MPa: number | null
  longTermModulus_MPa: number | null
  allowableStress_MPa: number | null
  crushingStrength_kN_per_m: number | null
  beddingFactor: number | null
  crushingSafetyFactor: number | null
  internalPressure_kPa: number
  /** Cover (ground to crown) at the start and at the end; the engine uses the smaller. */
  coverStart_m: number
  coverEnd_m: number
  installation: Installation
  trenchWidth_m: number | null
  wallFrictionKMu: number | null
  backfillUnitWeight_kN_per_m3: number
  frictionAngle_deg: number
  sidefillModulus_MPa: number
  beddingAngle_deg: number
  groundwaterAboveCrown_m: number
  designTrafficPressure_kPa: number
  deflectionLagFactor: number | null
  deflectionLimit_pct: number | null
  yearLaid: number | null
  /** Plus/minus this many metres in plan. */
  positionalAccuracy_m: number | null
  positionalQuality: PositionalQuality
}

/** One check of the stored baseline (no works): demand, capacity, utilisation. */
export interface BaselineCheckDto {
  id: string
  method: string
  unit: string
  demand: number
  capacity: number
  utilisation: number
}

/** The engine's result for the segment's stored data and no activities. */
export interface BaselineDto {
  verdict: Verdict | null
  governingCheck: string | null
  /** Highest utilisation of any check; above 1.0 means over capacity without any works. */
  utilisation: number | null
  overCapacity: boolean
  engineVersion: string | null
  /** Set when the engine could not assess the stored data; then the other fields are null. */
  error: string | null
  checks: BaselineCheckDto[]
  assumptions: string[]
  cautions: string[]
}

/** A row of the segment table. */
export interface PipeSegmentSummaryDto {
  id: number
  ownerRef: string
  medium: PipeMedium
  material: PipeMaterial
  outerDiameter_m: number
  coverMin_m: number
  yearLaid: number | null
  length_m: number
  baselineVerdict: Verdict | null
  baselineGoverningCheck: string | null
  baselineUtilisation: number | null
  baselineOverCapacity: boolean
  version: number
  updatedAt: string
}

/** One segment with all its data, for its owner's engineers (and admins). */
export interface PipeSegmentDto extends PipeSegmentData {
  id: number
  owner: { id: number; name: string }
  geometry: LineStringLonLat
  length_m: number
  baseline: BaselineDto
  lastImportId: number | null
  version: number
  createdAt: string
  updatedAt: string
}

export interface PipeSegmentPage {
  items: PipeSegmentSummaryDto[]
  total: number
  page: number
  pageSize: number
}

/** An import job as the progress view shows it. */
export interface NetworkImportDto {
  id: number
  ownerOrganisationId: number
  format: ImportFormat
  originalFilename: string
  fileSha256: string
  fileSizeBytes: number
  status: ImportStatus
  skipInvalid: boolean | null
  featuresTotal: number
  featuresProcessed: number
  featuresValid: number
  featuresInvalid: number
  segmentsInserted: number
  segmentsUpdated: number
  /** Problems with the file as a whole (not JSON, not a FeatureCollection, no WKT column...). */
  fileIssues: FieldIssue[]
  errorMessage: string | null
  createdBy: number | null
  createdAt: string
  validatedAt: string | null
  committedAt: string | null
}

/** A page of the per-feature report. */
export interface ImportReportPage {
  importId: number
  status: ImportStatus
  featuresInvalid: number
  /** True when more issues were found than the report keeps (the counts stay exact). */
  truncated: boolean
  items: FeatureIssue[]
  total: number
  page: number
  pageSize: number
}

/** A target field the mapping step can fill, for the mapping form. */
export interface MappingTargetField {
  field: keyof PipeSegmentData
  required: boolean
  unit: string | null
}

/** What the mapping step needs: the file's attribute names, a few sample rows, the mapping. */
export interface ImportPreviewDto {
  importId: number
  format: ImportFormat
  sourceAttributes: string[]
  sampleFeatures: Record<string, unknown>[]
  mapping: ImportMapping
  targetFields: MappingTargetField[]
  fileIssues: FieldIssue[]
}

/** The public screening outline: where pipes lie, whose, what medium; no design data. */
export interface OutlineFeature {
  type: 'Feature'
  id: number
  properties: { ownerName: string; medium: PipeMedium }
  geometry: LineStringLonLat
}

export interface OutlineCollection {
  type: 'FeatureCollection'
  features: OutlineFeature[]
  /** True when the view held more segments than the outline returns; zoom in for all. */
  truncated: boolean
}

/**
 * Below this zoom level the network map gets each line as its two end points only. At zoom 13
 * a pixel is about 12 m on the ground in the demo town, so the bends of a typical 20-50 m
 * segment are a few pixels at most; dropping the inner vertices cuts the payload and the
 * transform work. From this zoom on the lines come with every vertex.
 */
export const MAP_LINES_DETAIL_ZOOM = 14

/**
 * One segment on the owner's network map, in compact form: short property names because a
 * view can hold 20,000 of them. `m` medium, `u` baseline utilisation (null when not assessed),
 * `o` 1 when over capacity without any works, else 0.
 */
export interface MapLineFeature {
  type: 'Feature'
  id: number
  properties: { m: PipeMedium; u: number | null; o: 0 | 1 }
  /** WGS84, rounded to 6 decimals (about 0.1 m); only the two end points below zoom 14. */
  geometry: LineStringLonLat
}

/** `GET /api/network/map-lines`: the owner's segments in a map view. */
export interface MapLineCollection {
  type: 'FeatureCollection'
  features: MapLineFeature[]
  /** True when the view held more segments than the limit; zoom in for all. */
  truncated: boolean
}
