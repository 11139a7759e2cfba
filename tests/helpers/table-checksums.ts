import { QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'

/**
 * CHECKSUM TABLE of every table of the test database but the session store (it changes on
 * every signed-in call): equal before and after means no row was added, changed or removed.
 */
export async function tableChecksums(sequelize: Sequelize): Promise<Record<string, string>> {
  const tables = await sequelize.query<{ t: string }>(
    "SELECT TABLE_NAME AS t FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_TYPE = 'BASE TABLE' AND TABLE_NAME <> 'sessions'",
    { type: QueryTypes.SELECT },
  )
  const rows = await sequelize.query<{ Table: string; Checksum: string | number | null }>(
    `CHECKSUM TABLE ${tables.map((r) => `\`${r.t}\``).join(', ')}`,
    { type: QueryTypes.SELECT },
  )
  return Object.fromEntries(rows.map((r) => [r.Table.split('.').pop()!, String(r.Checksum)]))
}
