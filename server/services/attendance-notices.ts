import { Op, QueryTypes } from 'sequelize'
import type { Sequelize } from 'sequelize'
import type { PermitCondition } from '../../shared/types/permits.ts'
import type { AppConfig } from '../config.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { plannedStartNoticeMail } from '../mail/templates/planned-start-notice.ts'
import { Application, SiteEvent } from '../models/index.ts'
import { organisationEmails } from './mail-recipients.ts'
import { parseJson } from './review-dto.ts'
import { siteRequirements } from './site-requirements.ts'
import { currentPermit, siteTime } from './site-works.ts'

/**
 * When the planned-start notice for an owner goes out: its notice hours before the planned
 * start, less one scheduler interval, so that a run never falls after the moment and the
 * notice always arrives at least `notice_h` ahead. Project rule: earlier rather than late.
 */
export const noticeDueAt = (plannedAt: Date, notice_h: number, intervalS: number): Date =>
  new Date(plannedAt.getTime() - notice_h * 3_600_000 - intervalS * 1000)

/**
 * Send the planned-start notices that are due: for the latest planned start of every granted
 * application not yet started, to each owner whose conditions ask to attend, once its time has
 * come (noticeDueAt). Each notice is claimed by its row in attendance_notices inside the mail's
 * transaction, so it is sent once even with several processes. Returns how many were sent.
 */
export async function sendAttendanceNoticesOnce(
  sequelize: Sequelize,
  cfg: AppConfig,
  now = new Date(),
): Promise<number> {
  const planned = await SiteEvent.findAll({
    where: { kind: 'planned_start', at: { [Op.gt]: now } },
    order: [['id', 'DESC']],
  })
  const seen = new Set<number>()
  let sent = 0
  for (const e of planned) {
    // Only the latest planned start of an application counts.
    if (seen.has(e.applicationId)) continue
    seen.add(e.applicationId)
    const latest = await SiteEvent.findOne({
      where: { applicationId: e.applicationId, kind: { [Op.in]: ['planned_start', 'started'] } },
      order: [['id', 'DESC']],
      attributes: ['id', 'kind'],
    })
    if (!latest || latest.id !== e.id) continue
    const a = await Application.findByPk(e.applicationId)
    if (!a || a.status !== 'granted') continue
    const permit = await currentPermit(a.id)
    if (!permit) continue
    const req = await siteRequirements(parseJson<PermitCondition[]>(permit.conditions))
    for (const o of req.attendance) {
      if (now < noticeDueAt(e.at, o.notice_h, cfg.REMINDER_INTERVAL_S)) continue
      const claimed = await sequelize.transaction(async (transaction) => {
        const [, inserted] = await sequelize.query(
          `INSERT IGNORE INTO attendance_notices
             (site_event_id, owner_organisation_id, notice_h, sent_at, created_at)
           VALUES (?, ?, ?, ?, ?)`,
          {
            replacements: [e.id, o.owner.id, o.notice_h, now, now],
            type: QueryTypes.INSERT,
            transaction,
          },
        )
        if (!inserted) return false
        const mail = plannedStartNoticeMail({
          ownerName: o.owner.name,
          reference: a.reference ?? `#${a.id}`,
          permitNumber: permit.number,
          siteAddress: a.siteAddress,
          plannedStart: siteTime(e.at),
          notice_h: o.notice_h,
          contactName: a.contactName,
          contactPhone: a.contactPhone,
          note: e.note,
        })
        for (const to of await organisationEmails(o.owner.id, 'asset_engineer', transaction)) {
          await enqueueMail(
            { to: [to], ...mail, related: { type: 'application', id: a.id } },
            transaction,
          )
        }
        return true
      })
      if (claimed) sent++
    }
  }
  return sent
}
