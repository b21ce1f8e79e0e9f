import type { RouteRecordRaw } from 'vue-router';
import type { RouteAccess } from './access';

declare module 'vue-router' {
  interface RouteMeta {
    /** Who may open the page; routes without it count as 'signed_in' (closed by default). */
    access?: RouteAccess;
    /** Shown in the browser tab. */
    title?: string;
    /** Pages for signed-out people (sign-in): a signed-in visitor goes home instead. */
    guestOnly?: boolean;
  }
}

/** The route table. Every page but the home page is loaded on demand. */
export const routes: RouteRecordRaw[] = [
  {
    path: '/',
    name: 'workbench',
    component: () => import('@/views/WorkbenchView.vue'),
    meta: { access: 'public', title: 'Workbench' },
  },
  {
    path: '/library',
    name: 'library',
    component: () => import('@/views/LibraryView.vue'),
    meta: { access: 'public', title: 'Library' },
  },
  {
    path: '/library/consistency',
    name: 'library-consistency',
    component: () => import('@/views/ConsistencyView.vue'),
    meta: { access: { site: 'curator' }, title: 'Consistency check' },
  },
  {
    path: '/derive',
    name: 'derive',
    component: () => import('@/views/DeriveView.vue'),
    meta: { access: 'public', title: 'Derive' },
  },
  {
    path: '/library/species/:speciesId',
    name: 'library-species',
    component: () => import('@/views/SpeciesView.vue'),
    meta: { access: 'public', title: 'Species' },
  },
  {
    path: '/calorimetry',
    name: 'calorimetry',
    component: () => import('@/views/CalorimetryView.vue'),
    meta: { access: 'public', title: 'Calorimetry' },
  },
  {
    path: '/amendments',
    name: 'amendments',
    component: () => import('@/views/AmendmentsView.vue'),
    meta: { access: 'signed_in', title: 'Amendments' },
  },
  {
    path: '/amendments/new',
    name: 'amendment-new',
    component: () => import('@/views/NewAmendmentView.vue'),
    meta: { access: 'signed_in', title: 'New amendment' },
  },
  {
    path: '/amendments/import',
    name: 'amendment-import',
    component: () => import('@/views/ImportAmendmentView.vue'),
    meta: { access: 'signed_in', title: 'Import library tables' },
  },
  {
    path: '/amendments/:amendmentId',
    name: 'amendment',
    component: () => import('@/views/AmendmentView.vue'),
    meta: { access: 'signed_in', title: 'Amendment' },
  },
  {
    path: '/sign-in',
    name: 'sign-in',
    component: () => import('@/views/SignInView.vue'),
    meta: { access: 'public', title: 'Sign in', guestOnly: true },
  },
  {
    path: '/reset-password',
    name: 'reset-password',
    component: () => import('@/views/ResetPasswordView.vue'),
    meta: { access: 'public', title: 'Reset password' },
  },
  {
    path: '/invitations/:token',
    name: 'invitation',
    component: () => import('@/views/InvitationView.vue'),
    meta: { access: 'public', title: 'Invitation' },
  },
  {
    path: '/account',
    name: 'account',
    component: () => import('@/views/AccountView.vue'),
    meta: { access: 'signed_in', title: 'Account' },
  },
  { path: '/teams/:teamId', redirect: (to) => ({ name: 'team-notes', params: to.params }) },
  {
    path: '/teams/:teamId/notes',
    name: 'team-notes',
    component: () => import('@/views/TeamNotesView.vue'),
    meta: { access: { team: 'viewer' }, title: 'Team notes' },
  },
  {
    path: '/teams/:teamId/derived',
    name: 'team-derived',
    component: () => import('@/views/TeamDerivedValuesView.vue'),
    meta: { access: { team: 'viewer' }, title: 'Derived values' },
  },
  {
    path: '/teams/:teamId/members',
    name: 'team-members',
    component: () => import('@/views/TeamMembersView.vue'),
    meta: { access: { team: 'viewer' }, title: 'Members' },
  },
  {
    path: '/teams/:teamId/sets',
    name: 'team-sets',
    component: () => import('@/views/TeamSetsView.vue'),
    meta: { access: { team: 'viewer' }, title: 'Reaction sets' },
  },
  {
    path: '/teams/:teamId/sets/:setId',
    name: 'team-set',
    component: () => import('@/views/SetView.vue'),
    meta: { access: { team: 'viewer' }, title: 'Reaction set' },
  },
  {
    // A share link: no sign-in; the token is the only key.
    path: '/shared/:token',
    name: 'shared-set',
    component: () => import('@/views/SharedSetView.vue'),
    meta: { access: 'public', title: 'Shared reaction set' },
  },
  { path: '/admin', redirect: { name: 'admin-users' } },
  {
    path: '/admin/users',
    name: 'admin-users',
    component: () => import('@/views/AdminUsersView.vue'),
    meta: { access: { site: 'site_admin' }, title: 'Users' },
  },
  {
    path: '/admin/teams',
    name: 'admin-teams',
    component: () => import('@/views/AdminTeamsView.vue'),
    meta: { access: { site: 'site_admin' }, title: 'Teams' },
  },
  {
    path: '/admin/outbox',
    name: 'admin-outbox',
    component: () => import('@/views/OutboxView.vue'),
    meta: { access: { site: 'site_admin' }, title: 'Outbox' },
  },
  {
    path: '/admin/audit-log',
    name: 'admin-audit-log',
    component: () => import('@/views/AuditLogView.vue'),
    meta: { access: { site: 'site_admin' }, title: 'Audit log' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/views/NotFoundView.vue'),
    meta: { access: 'public', title: 'Not found' },
  },
];
