import type { Writable } from 'node:stream'
import { once } from 'node:events'
import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import type { PipeMedium } from '../../shared/types/network.ts'
import { gridToLonLat } from './network-segments.ts'
import { SEGMENT_DATA_COLUMNS, SEGMENT_DATA_FIELDS } from './segment-columns.ts'

/** Rows read per query while exporting (keyset paging on id). */
const EXPORT_BATCH = 1000

const SELECT_COLS = [
  'id',
  ...SEGMENT_DATA_FIELDS.map((f) => `${SEGMENT_DATA_COLUMNS[f]} AS \`${f}\``),
  'length_m',
  'baseline_verdict AS baselineVerdict',
  'baseline_utilisation AS baselineUtilisation',
  'baseline_over_capacity AS baselineOverCapacity',
  'version',
  'ST_AsGeoJSON(geom) AS g',
].join(', ')

/**
 * Writes the owner's segments as one GeoJSON FeatureCollection (RFC 7946, WGS84) to `out`,
 * streamed in batches so memory stays flat for 100,000 segments. Properties carry the
 * design-data fields under their own names, so the file imports again without any mapping;
 * `segmentId`, `length_m`, `version` and the baseline fields are for information and ignored on import.
 *
 * @returns the number of features written
 */
export async function exportSegments(
  sequelize: Sequelize,
  epsg: number,
  filter: { ownerOrganisationId: number | null; medium?: PipeMedium },
  out: Writable,
): Promise<number> {
  const write = async (text: string) => {
    if (!out.write(text)) await once(out, 'drain')
  }
  await write('{"type":"FeatureCollection","features":[\n')
  let lastId = 0
  let n = 0
  for (;;) {
    if (out.destroyed) break
    const where = ['id > ?']
    const params: unknown[] = [lastId]
    if (filter.ownerOrganisationId !== null) {
      where.push('owner_organisation_id = ?')
      params.push(filter.ownerOrganisationId)
    }
    if (filter.medium) {
      where.push('medium = ?')
      params.push(filter.medium)
    }
    const rows = await sequelize.query<Record<string, unknown> & { id: number; g: unknown }>(
      `SELECT ${SELECT_COLS} FROM pipe_segments WHERE ${where.join(' AND ')} ORDER BY id LIMIT ${EXPORT_BATCH}`,
      { replacements: params, type: QueryTypes.SELECT },
    )
    if (!rows.length) break
    const parts: string[] = []
    for (const r of rows) {
      const {
        id,
        g,
        length_m,
        baselineVerdict,
        baselineUtilisation,
        baselineOverCapacity,
        version,
        ...data
      } = r
      const geom = (typeof g === 'string' ? JSON.parse(g) : g) as { coordinates: number[][] }
      parts.push(
        JSON.stringify({
          type: 'Feature',
          id: Number(id),
          properties: {
            ...data,
            segmentId: Number(id),
            length_m,
            version,
            baselineVerdict,
            baselineUtilisation,
            baselineOverCapacity: Boolean(baselineOverCapacity),
          },
          geometry: gridToLonLat(geom.coordinates, epsg),
        }),
      )
      lastId = Number(id)
    }
    await write((n ? ',\n' : '') + parts.join(',\n'))
    n += rows.length
    if (rows.length < EXPORT_BATCH) break
  }
  await write('\n]}\n')
  return n
}
