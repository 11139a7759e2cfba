import { Op } from 'sequelize'
import type { Sequelize } from 'sequelize'
import { Application, Permit } from '../models/index.ts'
import { recordAudit } from './audit.ts'
import { isoToday } from './review-clock.ts'

/**
 * Mark permits whose last day has passed as expired, and their applications with them. Reads
 * already treat such permits as expired; this keeps the stored status and the lists in step.
 * Conditional updates, so two processes running it at once do no harm. Returns how many.
 */
export async function expirePermitsOnce(sequelize: Sequelize, now = new Date()): Promise<number> {
  const today = isoToday(now)
  const due = await Permit.findAll({
    where: { status: 'valid', validTo: { [Op.lt]: today } },
    attributes: ['id', 'applicationId'],
  })
  let n = 0
  for (const p of due) {
    await sequelize.transaction(async (transaction) => {
      const [changed] = await Permit.update(
        { status: 'expired' },
        { where: { id: p.id, status: 'valid' }, transaction },
      )
      if (!changed) return
      await Application.update(
        { status: 'expired' },
        { where: { id: p.applicationId, status: 'granted' }, transaction },
      )
      await recordAudit(
        {
          actorUserId: null,
          action: 'permit-expired',
          entityType: 'permit',
          entityId: p.id,
          details: { applicationId: p.applicationId },
        },
        transaction,
      )
      n++
    })
  }
  return n
}
