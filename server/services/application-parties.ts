import type { Transaction } from 'sequelize'
import { Op } from 'sequelize'
import { Application, OwnerReview } from '../models/index.ts'
import type { User } from '../models/index.ts'
import { canRead } from './applications.ts'

/**
 * The parties of an application: its applicant organisation, the permit office (once it is
 * submitted), admins, and the engineers of every owner whose pipes it affects. Returns the
 * application when the user is one of them, otherwise null (callers answer 404).
 */
export async function applicationForParty(
  user: User,
  applicationId: number,
  transaction?: Transaction,
): Promise<Application | null> {
  const a = await Application.findByPk(applicationId, { transaction })
  if (!a) return null
  if (canRead(user, a)) return a
  if (user.role === 'asset_engineer') {
    const n = await OwnerReview.count({
      where: {
        applicationId,
        ownerOrganisationId: user.organisationId,
        state: { [Op.ne]: 'not_affected' },
      },
      transaction,
    })
    return n > 0 ? a : null
  }
  return null
}
