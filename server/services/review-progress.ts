import { QueryTypes } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'
import type { ApplicationStatus } from '../../shared/types/application.ts'
import { Application } from '../models/index.ts'
import { recordAudit } from './audit.ts'

/** Application statuses in which owner reviews may still change. */
export const REVIEWABLE_STATUSES: readonly ApplicationStatus[] = [
  'with_owners',
  'ready_for_decision',
]

/**
 * Lock the application row for the rest of the transaction. Every change to its reviews takes
 * this lock first, so the "all answered?" count below sees every other committed change.
 */
export async function lockApplication(
  id: number,
  transaction: Transaction,
): Promise<Application | null> {
  return Application.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE })
}

/**
 * Move the (locked) application between `with_owners` and `ready_for_decision` after a review
 * changed: ready when no review is waiting or has an open question. Returns the status.
 */
export async function refreshApplicationStatus(
  sequelize: Sequelize,
  application: Application,
  actorUserId: number,
  transaction: Transaction,
): Promise<ApplicationStatus> {
  if (!REVIEWABLE_STATUSES.includes(application.status)) return application.status
  // A locking read: it sees the latest committed rows, not the transaction's first snapshot.
  // Forced onto the (application, owner) index so its share locks cover this application's
  // reviews only; through the (state, due_on) index they spanned other applications' rows and
  // decisions on different applications deadlocked under load.
  const [row] = await sequelize.query<{ n: number | bigint }>(
    `SELECT COUNT(*) AS n FROM owner_reviews
      FORCE INDEX (owner_reviews_application_id_owner_organisation_id)
      WHERE application_id = ? AND state IN ('waiting', 'information_requested') LOCK IN SHARE MODE`,
    { replacements: [application.id], type: QueryTypes.SELECT, transaction },
  )
  const open = Number(row?.n ?? 0)
  const next: ApplicationStatus = open === 0 ? 'ready_for_decision' : 'with_owners'
  if (next !== application.status) {
    application.status = next
    application.version = application.version + 1
    await application.save({ transaction })
    await recordAudit(
      {
        actorUserId,
        action: 'application-status-changed',
        entityType: 'application',
        entityId: application.id,
        details: { status: next, openReviews: open },
      },
      transaction,
    )
  }
  return next
}
