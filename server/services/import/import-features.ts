import { crsTransform } from '../../../shared/geo/crs.ts'
import type { ImportMapping } from '../../../shared/schemas/import-mapping.ts'
import type { FeatureIssue, ImportFormat, PipeMedium } from '../../../shared/types/network.ts'
import { PIPE_MEDIA } from '../../../shared/types/network.ts'
import { csvReader } from './csv-reader.ts'
import { geoJsonReader } from './geojson-reader.ts'
import { mapFeature } from './map-feature.ts'
import type { MappedSegment } from './map-feature.ts'
import type { SourceReader } from './source-feature.ts'

/** One feature after mapping and every check, including "owner_ref used twice in this file". */
export type CheckedFeature =
  | { index: number; ok: true; segment: MappedSegment }
  | { index: number; ok: false; ownerRef: string | null; issues: FeatureIssue[] }

export interface ImportSource {
  path: string
  format: ImportFormat
  mapping: ImportMapping
  ownerMedium: string | null
  serviceArea: readonly [number, number, number, number]
  epsg: number
}

/** A reader for the file's format. */
export function readerFor(src: Pick<ImportSource, 'path' | 'format' | 'mapping'>): SourceReader {
  return src.format === 'csv' ? csvReader(src.path, src.mapping.csv) : geoJsonReader(src.path)
}

/**
 * Streams the file's features through the mapping and the checks, in file order. Both passes
 * (validate, commit) run this same generator over the same file and mapping snapshot, so they
 * agree on which features are valid. File-level problems surface from `reader.fileIssues()`
 * at the end, or as a FileLevelError thrown mid-way.
 */
export async function* checkedFeatures(
  src: ImportSource,
  reader: SourceReader,
): AsyncGenerator<CheckedFeature> {
  const ctx = {
    mapping: src.mapping,
    textValues: src.format === 'csv',
    ownerMedium: (PIPE_MEDIA as readonly string[]).includes(src.ownerMedium ?? '')
      ? (src.ownerMedium as PipeMedium)
      : null,
    serviceArea: src.serviceArea,
    crs: crsTransform(src.epsg),
  }
  const firstIndexOfRef = new Map<string, number>()
  for await (const f of reader.features()) {
    const r = mapFeature(f, ctx)
    if (!r.ok) {
      yield { index: f.index, ok: false, ownerRef: r.ownerRef, issues: r.issues }
      continue
    }
    const ref = r.segment.data.ownerRef
    const earlier = firstIndexOfRef.get(ref)
    if (earlier !== undefined) {
      yield {
        index: f.index,
        ok: false,
        ownerRef: ref,
        issues: [
          {
            index: f.index,
            ownerRef: ref,
            field: 'ownerRef',
            message: `The owner reference "${ref}" is already used by feature ${earlier} of this file`,
          },
        ],
      }
      continue
    }
    firstIndexOfRef.set(ref, f.index)
    yield { index: f.index, ok: true, segment: r.segment }
  }
}
