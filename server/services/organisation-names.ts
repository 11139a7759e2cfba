import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'

/**
 * Names of the given organisations, by id. Spatial queries fetch owner names with this second
 * query instead of a JOIN: MariaDB 10.11.19 fails a spatial-index range scan joined to
 * `organisations` when the join becomes a constant lookup (owner filter given) with
 * "ERROR 1207 Update locks cannot be acquired during a READ UNCOMMITTED transaction"
 * (reproduced here; see the report of issue 4).
 */
export async function organisationNames(
  sequelize: Sequelize,
  ids: Iterable<number>,
): Promise<Map<number, string>> {
  const list = [...new Set(ids)]
  if (!list.length) return new Map()
  const rows = await sequelize.query<{ id: number; name: string }>(
    'SELECT id, name FROM organisations WHERE id IN (?)',
    {
      replacements: [list],
      type: QueryTypes.SELECT,
    },
  )
  return new Map(rows.map((r) => [r.id, r.name]))
}
