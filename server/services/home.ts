import { Op } from 'sequelize'
import { Organisation, User } from '../models/index.ts'

/** One line of a user's "needs my attention today" list. */
export interface HomeItem {
  key: string
  label: string
  count: number
  to: string
}

/**
 * What each role should look at first. Counts for records later features add (applications,
 * reviews, permits) join here as those features land.
 */
export async function homeItemsFor(user: User): Promise<HomeItem[]> {
  switch (user.role) {
    case 'admin':
      return [
        { key: 'users', label: 'Users', count: await User.count(), to: '/admin/users' },
        {
          key: 'organisations',
          label: 'Organisations',
          count: await Organisation.count(),
          to: '/admin/users',
        },
        {
          key: 'locked-users',
          label: 'Users locked out after failed sign-ins',
          count: await User.count({ where: { lockedUntil: { [Op.gt]: new Date() } } }),
          to: '/admin/users',
        },
      ]
    case 'applicant':
      return [
        { key: 'drafts', label: 'Draft applications', count: 0, to: '/applications' },
        { key: 'questions', label: 'Questions from network owners', count: 0, to: '/applications' },
      ]
    case 'asset_engineer':
      return [
        { key: 'reviews-due', label: 'Reviews due', count: 0, to: '/reviews' },
        {
          key: 'over-capacity',
          label: 'Pipes over capacity without works',
          count: 0,
          to: '/network',
        },
      ]
    case 'permit_officer':
      return [
        { key: 'ready', label: 'Ready for decision', count: 0, to: '/officer/applications' },
        { key: 'overdue', label: 'Owner reviews overdue', count: 0, to: '/officer/applications' },
      ]
  }
}
