import { QueryTypes } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'

/**
 * End every stored session of one user (after a password change), except `keepSid`. A session
 * row holds express-session's JSON, where passport keeps `{"passport":{"user":<id>}}`; rows are
 * picked by a LIKE on that and confirmed by parsing, so user 12 never matches user 123.
 *
 * @returns how many sessions were ended
 */
export async function endSessionsOfUser(
  sequelize: Sequelize,
  userId: number,
  opts: { keepSid?: string; transaction?: Transaction } = {},
): Promise<number> {
  const rows = await sequelize.query<{ sid: string; data: string | null }>(
    'SELECT sid, data FROM sessions WHERE data LIKE ?',
    {
      replacements: [`%"user":${Number(userId)}}%`],
      type: QueryTypes.SELECT,
      transaction: opts.transaction,
    },
  )
  const sids = rows
    .filter((r) => {
      if (r.sid === opts.keepSid || !r.data) return false
      try {
        return (JSON.parse(r.data) as { passport?: { user?: unknown } }).passport?.user === userId
      } catch {
        return false
      }
    })
    .map((r) => r.sid)
  if (!sids.length) return 0
  await sequelize.query('DELETE FROM sessions WHERE sid IN (?)', {
    replacements: [sids],
    transaction: opts.transaction,
  })
  return sids.length
}
