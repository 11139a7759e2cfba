import { Op } from 'sequelize'
import type { Transaction } from 'sequelize'
import { LIVE_STATUSES } from '../../shared/types/application.ts'
import type { ApplicationStatus } from '../../shared/types/application.ts'
import { Application, Permit } from '../models/index.ts'

/** An application whose works count as planned or under way, with the days they take. */
export interface LiveWorks {
  applicationId: number
  reference: string
  title: string
  status: ApplicationStatus
  /** First and last day counted, YYYY-MM-DD, inclusive. */
  from: string
  to: string
}

/**
 * Which of the given applications are live today, and for which days.
 *
 * Rules: live means submitted, with owners, ready for decision or granted (LIVE_STATUSES). A
 * granted application counts over its current permit's validity (an extension moves the end);
 * once that validity has ended it counts as expired even before the nightly expiry job marks it.
 * An application without both dates is left out (a submitted one always has them).
 *
 * @param ids application ids, or 'all' for every live application
 * @param today YYYY-MM-DD
 */
export async function liveWorks(
  ids: readonly number[] | 'all',
  today: string,
  transaction?: Transaction,
): Promise<Map<number, LiveWorks>> {
  const out = new Map<number, LiveWorks>()
  if (ids !== 'all' && ids.length === 0) return out
  const apps = await Application.findAll({
    where: {
      status: { [Op.in]: [...LIVE_STATUSES] },
      ...(ids === 'all' ? {} : { id: { [Op.in]: [...new Set(ids)] } }),
    },
    attributes: ['id', 'reference', 'title', 'status', 'startsOn', 'endsOn'],
    transaction,
  })
  const granted = apps.filter((a) => a.status === 'granted').map((a) => a.id)
  const permits = granted.length
    ? await Permit.findAll({
        where: { applicationId: { [Op.in]: granted }, status: 'valid' },
        attributes: ['applicationId', 'validFrom', 'validTo', 'issue'],
        order: [['issue', 'ASC']],
        transaction,
      })
    : []
  const current = new Map(permits.map((p) => [p.applicationId, p]))
  for (const a of apps) {
    let from = a.startsOn
    let to = a.endsOn
    if (a.status === 'granted') {
      const p = current.get(a.id)
      if (p) {
        from = p.validFrom
        to = p.validTo
      }
      if (to && to < today) continue
    }
    if (!from || !to) continue
    out.set(a.id, {
      applicationId: a.id,
      reference: a.reference ?? `#${a.id}`,
      title: a.title,
      status: a.status,
      from,
      to,
    })
  }
  return out
}
