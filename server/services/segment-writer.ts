import { QueryTypes } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'
import type { PipeSegmentData } from '../../shared/types/network.ts'
import type { BaselineColumns } from './pipe-baseline.ts'
import { SEGMENT_DATA_COLUMNS, SEGMENT_DATA_FIELDS, gridLineWkt } from './segment-columns.ts'

/** One segment to write: design data, projected line, baseline. */
export interface SegmentRow {
  data: PipeSegmentData
  grid: [number, number][]
  length_m: number
  baseline: BaselineColumns
}

/** Rows per INSERT statement (about 50 placeholders each; well under the packet limit). */
export const SEGMENT_BATCH_SIZE = 500

const DATA_COLS = SEGMENT_DATA_FIELDS.map((f) => SEGMENT_DATA_COLUMNS[f])
const BASELINE_COLS = [
  'baseline_verdict',
  'baseline_governing_check',
  'baseline_utilisation',
  'baseline_over_capacity',
  'baseline_result',
  'baseline_engine_version',
  'baseline_error',
]
const ALL_COLS = [
  'owner_organisation_id',
  ...DATA_COLS,
  'length_m',
  'geom',
  ...BASELINE_COLS,
  'last_import_id',
  'version',
  'created_at',
  'updated_at',
]
// Re-importing an owner_ref updates the row in place and bumps its version (optimistic lock).
const UPDATE_COLS = [
  ...DATA_COLS.filter((c) => c !== 'owner_ref'),
  'length_m',
  'geom',
  ...BASELINE_COLS,
  'last_import_id',
  'updated_at',
]
const UPSERT_HEAD = `INSERT INTO pipe_segments (${ALL_COLS.join(', ')}) VALUES `
const UPSERT_TAIL = ` ON DUPLICATE KEY UPDATE version = version + 1, ${UPDATE_COLS.map((c) => `${c} = VALUES(${c})`).join(', ')}`

/**
 * Insert or update (by owner and owner_ref) a batch of segments in one statement, inside the
 * caller's transaction. Geometry goes through ST_GeomFromText with the configured SRID, since
 * Sequelize would store SRID 0 (stack-notes P4).
 *
 * @returns how many rows were new and how many existed (MariaDB counts an updated row twice in
 *   affectedRows; every update changes updated_at, so none counts zero)
 */
export async function upsertSegments(
  sequelize: Sequelize,
  ownerOrganisationId: number,
  rows: readonly SegmentRow[],
  opts: { transaction: Transaction; epsg: number; importId: number | null },
): Promise<{ inserted: number; updated: number }> {
  if (!rows.length) return { inserted: 0, updated: 0 }
  const now = new Date()
  const placeholders = `(?, ${DATA_COLS.map(() => '?').join(', ')}, ?, ST_GeomFromText(?, ${Number(opts.epsg)}), ${BASELINE_COLS.map(() => '?').join(', ')}, ?, 1, ?, ?)`
  const values: unknown[] = []
  for (const r of rows) {
    values.push(ownerOrganisationId)
    for (const f of SEGMENT_DATA_FIELDS) values.push(r.data[f])
    values.push(r.length_m, gridLineWkt(r.grid))
    const b = r.baseline
    values.push(
      b.verdict,
      b.governingCheck,
      b.utilisation,
      b.overCapacity,
      b.result === null ? null : JSON.stringify(b.result),
      b.engineVersion,
      b.error,
    )
    values.push(opts.importId, now, now)
  }
  const sql = UPSERT_HEAD + rows.map(() => placeholders).join(', ') + UPSERT_TAIL
  const [, meta] = (await sequelize.query(sql, {
    replacements: values,
    type: QueryTypes.INSERT,
    transaction: opts.transaction,
  })) as [unknown, number]
  const affected = Number(meta)
  const updated = Math.max(0, affected - rows.length)
  return { inserted: rows.length - updated, updated }
}
