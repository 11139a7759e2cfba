import type { StructureIssue } from '../../../shared/geo/geojson-structure.ts'
import type { FieldIssue } from '../../../shared/errors.ts'

/**
 * One feature as a reader hands it on, before mapping: its attributes and its geometry as
 * GeoJSON in lon/lat, plus any structural problems the reader found (paths relative to the
 * feature, e.g. `geometry.coordinates.2`).
 */
export interface SourceFeature {
  /** Position in the file, from 0. */
  index: number
  /** GeoJSON `id` when there is one. */
  id: string | number | null
  properties: Record<string, unknown> | null
  geometry: unknown
  structureIssues: StructureIssue[]
}

/** A problem that makes the whole file unusable (bad JSON, not a FeatureCollection, ...). */
export class FileLevelError extends Error {
  constructor(readonly issues: FieldIssue[]) {
    super(issues.map((i) => `${i.field}: ${i.message}`).join('; '))
    this.name = 'FileLevelError'
  }
}

/** A streaming reader of one import file. */
export interface SourceReader {
  /** The features in file order; throws FileLevelError when the file cannot be read on. */
  features(): AsyncGenerator<SourceFeature>
  /** Problems with the file as a whole, known once `features()` has run to its end. */
  fileIssues(): FieldIssue[]
  /** Attribute names in the order first seen (CSV: the header). */
  attributeNames(): string[]
}
