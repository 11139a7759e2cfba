import { Op } from 'sequelize'
import {
  Application,
  Assessment,
  ChangeReview,
  Organisation,
  PermitChangeRequest,
  PipeSegment,
  User,
} from '../models/index.ts'
import { countOverdueFollowUps } from './emergency-works.ts'
import { siteStates } from './site-works.ts'

/** One line of a user's "needs my attention today" list. */
export interface HomeItem {
  key: string
  label: string
  count: number
  to: string
}

async function onSiteCount(): Promise<number> {
  const granted = await Application.findAll({ where: { status: 'granted' }, attributes: ['id'] })
  const states = await siteStates(granted.map((a) => a.id))
  return [...states.values()].filter((s) => s === 'on_site').length
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
        {
          key: 'drafts',
          label: 'Draft applications',
          count: await Application.count({
            where: { applicantOrganisationId: user.organisationId, status: 'draft' },
          }),
          to: '/my-applications',
        },
        {
          key: 'in-progress',
          label: 'Applications with the owners or the permit office',
          count: await Application.count({
            where: {
              applicantOrganisationId: user.organisationId,
              status: { [Op.in]: ['submitted', 'with_owners', 'ready_for_decision'] },
            },
          }),
          to: '/my-applications',
        },
        {
          key: 'granted',
          label: 'Granted works (site pack, start and finish)',
          count: await Application.count({
            where: { applicantOrganisationId: user.organisationId, status: 'granted' },
          }),
          to: '/my-applications',
        },
      ]
    case 'asset_engineer':
      return [
        {
          key: 'applications-near-pipes',
          label: 'Submitted applications that reach your pipes',
          count: await Assessment.count({
            distinct: true,
            col: 'application_id',
            where: { ownerOrganisationId: user.organisationId },
          }),
          to: '/reviews',
        },
        {
          key: 'over-capacity',
          label: 'Pipes over capacity without works',
          count: await PipeSegment.count({
            where: { ownerOrganisationId: user.organisationId, baselineOverCapacity: true },
          }),
          to: '/network',
        },
        {
          key: 'change-reviews',
          label: 'Permit changes that touch your pipes, waiting for you',
          count: await ChangeReview.count({
            where: { ownerOrganisationId: user.organisationId, state: 'waiting' },
          }),
          to: '/change-requests',
        },
      ]
    case 'permit_officer':
      return [
        {
          key: 'submitted',
          label: 'New applications',
          count: await Application.count({ where: { status: 'submitted' } }),
          to: '/applications',
        },
        {
          key: 'ready',
          label: 'Ready for decision',
          count: await Application.count({ where: { status: 'ready_for_decision' } }),
          to: '/applications',
        },
        {
          key: 'on-site',
          label: 'Works on site now',
          count: await onSiteCount(),
          to: '/works-on-site',
        },
        {
          key: 'changes-ready',
          label: 'Permit changes ready for decision',
          count: await PermitChangeRequest.count({ where: { status: 'ready_for_decision' } }),
          to: '/change-requests',
        },
        {
          key: 'emergency-overdue',
          label: 'Emergency works whose full application is overdue',
          count: await countOverdueFollowUps(),
          to: '/works-on-site',
        },
      ]
  }
}
