import { createReadStream } from 'node:fs'
import { parse } from 'csv-parse'
import type { FieldIssue } from '../../../shared/errors.ts'
import { positionIssues } from '../../../shared/geo/geojson-structure.ts'
import { parseWktLineString } from '../../../shared/geo/wkt-linestring.ts'
import type { ImportMapping } from '../../../shared/schemas/import-mapping.ts'
import { FileLevelError } from './source-feature.ts'
import type { SourceFeature, SourceReader } from './source-feature.ts'

/** Longest accepted CSV field (a WKT line of ~50,000 vertices). */
const MAX_FIELD_CHARS = 2_000_000

/**
 * Streams a CSV file: a header row, then one segment per row with its geometry as a WKT
 * LINESTRING in WGS84 lon/lat in the mapping's WKT column. Values stay text here; the mapping
 * step turns them into numbers (with the mapping's decimal separator).
 */
export function csvReader(path: string, options: ImportMapping['csv']): SourceReader {
  let header: string[] = []
  const fileIssues: FieldIssue[] = []

  async function* features(): AsyncGenerator<SourceFeature> {
    const parser = createReadStream(path).pipe(
      parse({
        delimiter: options.delimiter,
        bom: true,
        relax_column_count: true,
        skip_empty_lines: true,
        trim: true,
        max_record_size: MAX_FIELD_CHARS,
        info: true,
      }),
    )
    let index = 0
    let wktAt = -1
    try {
      for await (const item of parser as AsyncIterable<{
        record: string[]
        info: { lines: number }
      }>) {
        const { record, info } = item
        if (!header.length) {
          header = record
          const seen = new Set<string>()
          header.forEach((h, i) => {
            if (!h)
              fileIssues.push({ field: `header.${i}`, message: `Column ${i + 1} has no name` })
            else if (seen.has(h))
              fileIssues.push({
                field: `header.${i}`,
                message: `The column "${h}" appears more than once`,
              })
            seen.add(h)
          })
          wktAt = header.indexOf(options.wktColumn)
          if (wktAt < 0) {
            fileIssues.push({
              field: 'header',
              message: `No geometry column "${options.wktColumn}" (columns: ${header.slice(0, 12).join(', ')}${header.length > 12 ? ', ...' : ''}); set the WKT column in the mapping`,
            })
          }
          if (fileIssues.length) return
          continue
        }
        const properties: Record<string, unknown> = {}
        header.forEach((h, i) => {
          if (i !== wktAt) properties[h] = record[i] ?? ''
        })
        const structureIssues = []
        if (record.length !== header.length) {
          structureIssues.push({
            path: `line ${info.lines}`,
            message: `The row has ${record.length} values, the header ${header.length}`,
          })
        }
        let geometry: unknown = null
        const wkt = parseWktLineString(record[wktAt] ?? '')
        if (!wkt.ok) structureIssues.push({ path: 'geometry', message: wkt.message })
        else if (wkt.srid !== null && wkt.srid !== 4326) {
          structureIssues.push({
            path: 'geometry',
            message: `The geometry must be WGS84 lon/lat (SRID=4326), got SRID=${wkt.srid}`,
          })
        } else {
          const bad = wkt.coordinates.flatMap((p, i) =>
            positionIssues(p, `geometry.coordinates.${i}`),
          )
          if (bad.length) structureIssues.push(bad[0]!)
          else if (wkt.coordinates.length < 2)
            structureIssues.push({
              path: 'geometry',
              message: 'A LINESTRING needs at least 2 positions',
            })
          geometry = { type: 'LineString', coordinates: wkt.coordinates }
        }
        yield { index, id: null, properties, geometry, structureIssues }
        index++
      }
    } catch (err) {
      if (err instanceof FileLevelError) throw err
      const e = err as { code?: string; message: string; lines?: number }
      if (typeof e.code === 'string' && e.code.startsWith('CSV_')) {
        throw new FileLevelError([
          {
            field: 'file',
            message: `The CSV file cannot be read${e.lines ? ` at line ${e.lines}` : ''}: ${e.message.replace(/^Invalid [^:]*: /, '')}`,
          },
        ])
      }
      throw err
    }
    if (!header.length) throw new FileLevelError([{ field: 'file', message: 'The file is empty' }])
  }

  return {
    features,
    fileIssues: () => fileIssues,
    attributeNames: () => header.filter((h) => h !== options.wktColumn),
  }
}
