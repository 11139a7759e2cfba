import type { RouteRecordRaw } from 'vue-router'
import {
  matAddLocationAlt,
  matAssignment,
  matConstruction,
  matEditCalendar,
  matFactCheck,
  matFolderOpen,
  matHistory,
  matHome,
  matLayers,
  matLibraryBooks,
  matMap,
  matMarkEmailRead,
  matPeople,
  matRequestQuote,
  matWarning,
} from '@quasar/extras/material-icons'
import './route-meta.ts'

// Every page is a lazy import, so each screen (and the map code) loads only when it is opened.

/** Routes as data; the order inside the main layout is the order of the navigation. */
export const routes: RouteRecordRaw[] = [
  {
    path: '/sign-in',
    component: () => import('../layouts/PlainLayout.vue'),
    children: [
      {
        path: '',
        name: 'sign-in',
        component: () => import('../pages/SignInPage.vue'),
        meta: { public: true, title: 'Sign in' },
      },
      {
        path: '/forgot-password',
        name: 'forgot-password',
        component: () => import('../pages/ForgotPasswordPage.vue'),
        meta: { public: true, title: 'Forgot password' },
      },
      {
        path: '/reset-password',
        name: 'reset-password',
        component: () => import('../pages/ResetPasswordPage.vue'),
        meta: { public: true, title: 'Choose a new password' },
      },
    ],
  },
  {
    path: '/',
    component: () => import('../layouts/MainLayout.vue'),
    children: [
      {
        path: '',
        name: 'home',
        component: () => import('../pages/HomePage.vue'),
        meta: { title: 'Home', navIcon: matHome },
      },

      // Applicant
      {
        path: 'my-applications',
        name: 'my-applications',
        component: () => import('../pages/MyApplicationsPage.vue'),
        meta: { title: 'My applications', navIcon: matFolderOpen, roles: ['applicant'] },
      },
      {
        path: 'new-application',
        name: 'new-application',
        component: () => import('../pages/ApplicationFormPage.vue'),
        meta: { title: 'New application', navIcon: matAddLocationAlt, roles: ['applicant'] },
      },
      {
        // The same form as a new application, for a saved draft.
        path: 'applications/:id(\\d+)/edit',
        name: 'application-edit',
        component: () => import('../pages/ApplicationFormPage.vue'),
        meta: { title: 'Draft application', roles: ['applicant'] },
      },
      {
        path: 'applications/:id(\\d+)',
        name: 'application-detail',
        component: () => import('../pages/ApplicationPage.vue'),
        meta: { title: 'Application', roles: ['applicant', 'permit_officer', 'admin'] },
      },

      {
        path: 'emergency-works',
        name: 'emergency-works',
        component: () => import('../pages/EmergencyWorksPage.vue'),
        meta: {
          title: 'Emergency works',
          navIcon: matWarning,
          roles: ['applicant'],
          summary:
            'Urgent repairs: report and start at once; nearby owners are told; the full application follows.',
        },
      },

      // Network engineer
      {
        path: 'reviews',
        name: 'reviews',
        component: () => import('../pages/ReviewsPage.vue'),
        meta: {
          title: 'Reviews',
          navIcon: matFactCheck,
          roles: ['asset_engineer'],
          summary:
            'The requests that touch your pipes, soonest due first, each with the affected segments, their checks and your decision.',
        },
      },
      {
        path: 'reviews/:id(\\d+)',
        name: 'review-detail',
        component: () => import('../pages/ReviewPage.vue'),
        meta: { title: 'Review', roles: ['asset_engineer'] },
      },
      {
        path: 'network',
        name: 'network',
        component: () => import('../pages/NetworkPage.vue'),
        meta: {
          title: 'Network',
          navIcon: matLayers,
          roles: ['asset_engineer'],
          summary:
            'Your pipes on the map and in a table, with their design data, baseline checks and imports from GeoJSON or CSV.',
        },
      },
      {
        path: 'network/import',
        name: 'network-import',
        component: () => import('../pages/NetworkImportPage.vue'),
        meta: { title: 'Import pipes', roles: ['asset_engineer'] },
      },
      {
        path: 'network/pipes/:id(\\d+)',
        name: 'pipe-detail',
        component: () => import('../pages/PipeDetailPage.vue'),
        meta: { title: 'Pipe', roles: ['asset_engineer'] },
      },
      {
        path: 'condition-library',
        name: 'condition-library',
        component: () => import('../pages/ConditionLibraryPage.vue'),
        meta: {
          title: 'Condition library',
          navIcon: matLibraryBooks,
          roles: ['asset_engineer'],
          summary:
            'Your standard conditions and protection rules, ready to attach to an acceptance in one click.',
        },
      },

      // Permit officer
      {
        path: 'applications',
        name: 'applications',
        component: () => import('../pages/OfficeQueuePage.vue'),
        meta: {
          title: 'Applications',
          navIcon: matAssignment,
          roles: ['permit_officer'],
          summary:
            'Every application in the borough with each owner’s answer; overdue reviews are marked so you can chase them.',
        },
      },
      {
        path: 'applications/:id(\\d+)/decision',
        name: 'application-decision',
        component: () => import('../pages/OfficeDecisionPage.vue'),
        meta: { title: 'Application decision', roles: ['permit_officer', 'admin'] },
      },
      {
        path: 'works-map',
        name: 'works-map',
        component: () => import('../pages/WorksMapPage.vue'),
        meta: {
          title: 'Works map',
          navIcon: matMap,
          roles: ['permit_officer'],
          summary:
            'All planned and live works on one map and timeline, with works that clash in place and time picked out.',
        },
      },
      {
        path: 'change-requests',
        name: 'change-requests',
        component: () => import('../pages/ChangeRequestsPage.vue'),
        meta: {
          title: 'Permit changes',
          navIcon: matEditCalendar,
          roles: ['asset_engineer', 'permit_officer'],
          summary:
            'Requests to extend or vary a granted permit; owners answer those that touch their pipes, the office decides.',
        },
      },
      {
        path: 'works-on-site',
        name: 'works-on-site',
        component: () => import('../pages/WorksOnSitePage.vue'),
        meta: {
          title: 'Works on site',
          navIcon: matConstruction,
          roles: ['permit_officer'],
          summary:
            'Works on the ground today: on site, granted and not started, and emergency works with their follow-up deadline.',
        },
      },
      {
        path: 'fee-schedule',
        name: 'fee-schedule',
        component: () => import('../pages/FeeSchedulePage.vue'),
        meta: {
          title: 'Fee schedule',
          navIcon: matRequestQuote,
          roles: ['permit_officer'],
          summary: 'The fees the street authority charges per permit, extension and activity.',
        },
      },

      // Administrator
      {
        path: 'admin/users',
        name: 'admin-users',
        component: () => import('../pages/UsersAndOrganisationsPage.vue'),
        meta: { title: 'Users and organisations', navIcon: matPeople, roles: ['admin'] },
      },
      {
        path: 'admin/mail',
        name: 'admin-mail',
        component: () => import('../pages/OutgoingMailPage.vue'),
        meta: { title: 'Outgoing mail', navIcon: matMarkEmailRead, roles: ['admin'] },
      },
      {
        path: 'admin/audit',
        name: 'admin-audit',
        component: () => import('../pages/AuditLogPage.vue'),
        meta: { title: 'Audit log', navIcon: matHistory, roles: ['admin'] },
      },
    ],
  },

  // The crew's site pack: phone first, without the desktop navigation; works offline once opened.
  {
    path: '/site',
    component: () => import('../layouts/PlainLayout.vue'),
    children: [
      {
        path: ':id(\\d+)',
        name: 'site-pack',
        component: () => import('../pages/SitePackPage.vue'),
        meta: {
          title: 'Site pack',
          roles: ['applicant', 'asset_engineer', 'permit_officer', 'admin'],
        },
      },
    ],
  },

  // Public: anyone may check a permit code (from the QR code on the PDF).
  {
    path: '/verify',
    component: () => import('../layouts/PlainLayout.vue'),
    children: [
      {
        path: ':code?',
        name: 'verify',
        component: () => import('../pages/VerifyPage.vue'),
        meta: { public: true, title: 'Check a permit' },
      },
    ],
  },

  // Must stay last: anything no route above matches.
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('../pages/NotFoundPage.vue'),
    meta: { public: true, title: 'Page not found' },
  },
]
