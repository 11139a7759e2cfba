import { Op } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { Application, Permit } from '../models/index.ts'
import { recordAudit } from './audit.ts'
import { rescreenCombined } from './combined-screening.ts'
import { isoToday } from './review-clock.ts'
import { screeningTransaction } from './segment-locks.ts'

/**
 * Mark one permit expired, and its application with it, then re-screen the segments its works
 * touched so they drop out of other applications' combined results. Conditional updates, so two
 * processes doing it at once do no harm. Returns whether this call expired it.
 */
export async function expirePermit(
  sequelize: Sequelize,
  permitId: number,
  now = new Date(),
): Promise<boolean> {
  const today = isoToday(now)
  return screeningTransaction(sequelize, async (transaction) => {
    const [changed] = await Permit.update(
      { status: 'expired' },
      { where: { id: permitId, status: 'valid', validTo: { [Op.lt]: today } }, transaction },
    )
    if (!changed) return false
    const permit = await Permit.findByPk(permitId, { attributes: ['applicationId'], transaction })
    const applicationId = permit!.applicationId
    await Application.update(
      { status: 'expired' },
      { where: { id: applicationId, status: 'granted' }, transaction },
    )
    const rescreen = await rescreenCombined(sequelize, applicationId, transaction, now)
    await recordAudit(
      {
        actorUserId: null,
        action: 'permit-expired',
        entityType: 'permit',
        entityId: permitId,
        details: { applicationId, rescreenedSegments: rescreen.segments },
      },
      transaction,
    )
    return true
  })
}

/**
 * Mark permits whose last day has passed as expired, and their applications with them (the
 * nightly job). Reads already treat such permits as expired; this keeps the stored status, the
 * lists and other applications' combined results in step. Returns how many.
 */
export async function expirePermitsOnce(sequelize: Sequelize, now = new Date()): Promise<number> {
  const due = await Permit.findAll({
    where: { status: 'valid', validTo: { [Op.lt]: isoToday(now) } },
    attributes: ['id'],
  })
  let n = 0
  for (const p of due) if (await expirePermit(sequelize, p.id, now)) n++
  return n
}
