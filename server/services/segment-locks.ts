import { QueryTypes, Transaction } from 'sequelize'
import type { Sequelize } from 'sequelize'

/**
 * Take row locks on pipe segments for a screening or re-screen, in ascending id order so that
 * two transactions locking overlapping sets queue up instead of deadlocking. Every writer of
 * assessments or combined results on a segment holds its lock until commit, so two
 * submissions beside the same pipe run their combined screening one after the other and the
 * second sees the first.
 */
export async function lockSegments(
  sequelize: Sequelize,
  ids: Iterable<number>,
  transaction: Transaction,
): Promise<void> {
  const sorted = [...new Set(ids)].sort((a, b) => a - b)
  if (!sorted.length) return
  await sequelize.query('SELECT id FROM pipe_segments WHERE id IN (?) ORDER BY id FOR UPDATE', {
    replacements: [sorted],
    type: QueryTypes.SELECT,
    transaction,
  })
}

/**
 * A transaction for work that screens or re-screens combined results. READ COMMITTED, so that
 * each statement after a segment lock sees what the transaction that held the lock before
 * committed; under REPEATABLE READ the snapshot taken at the transaction's first read would
 * still hide that other application's assessment rows and status.
 */
export function screeningTransaction<T>(
  sequelize: Sequelize,
  work: (transaction: Transaction) => Promise<T>,
): Promise<T> {
  return sequelize.transaction(
    { isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED },
    work,
  )
}
