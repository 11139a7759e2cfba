import {
  matAddLocationAlt,
  matAssignment,
  matFactCheck,
  matHistory,
  matLayers,
  matMap,
  matMarkEmailRead,
  matPeople,
} from '@quasar/extras/material-icons'
import type { Role } from '../../../shared/types/roles.ts'

export interface QuickAction {
  label: string
  /** Route name. */
  to: string
  icon: string
}

/** How each role's home page introduces itself, and the one or two things they start from. */
export interface RoleIntro {
  title: string
  lede: string
  /** Shown when nothing needs attention. */
  quiet: string
  actions: QuickAction[]
}

export const ROLE_INTROS: Record<Role, RoleIntro> = {
  applicant: {
    title: 'Your works near buried pipes',
    lede: 'Draw where you will dig, lift or stockpile. Trenchward checks the pipes below and collects the owners’ answers for you.',
    quiet: 'When an owner asks a question or a permit is issued, it will show here.',
    actions: [{ label: 'Start a new application', to: 'new-application', icon: matAddLocationAlt }],
  },
  asset_engineer: {
    title: 'Requests that touch your network',
    lede: 'Review the works planned near your pipes, with the computed effect on each segment, and keep your network data current.',
    quiet: 'When a request reaches your pipes, its review will show here with its due date.',
    actions: [
      { label: 'Open the review queue', to: 'reviews', icon: matFactCheck },
      { label: 'Your network', to: 'network', icon: matLayers },
    ],
  },
  permit_officer: {
    title: 'Permits for the borough’s streets',
    lede: 'See every request in your area, chase late owner reviews, spot clashing works and issue or refuse permits.',
    quiet: 'Applications waiting for a decision or an overdue review will show here.',
    actions: [
      { label: 'All applications', to: 'applications', icon: matAssignment },
      { label: 'Works map', to: 'works-map', icon: matMap },
    ],
  },
  admin: {
    title: 'Running Trenchward',
    lede: 'Look after the people and organisations who use Trenchward, the mail it sends and the record of what was done.',
    quiet: 'Invitations not yet taken up and undelivered mail will show here.',
    actions: [
      { label: 'Users and organisations', to: 'admin-users', icon: matPeople },
      { label: 'Outgoing mail', to: 'admin-mail', icon: matMarkEmailRead },
      { label: 'Audit log', to: 'admin-audit', icon: matHistory },
    ],
  },
}
