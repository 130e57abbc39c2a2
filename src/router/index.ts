/**
 * Routes are named, lazy and take params as props. `meta.auth` marks signed-in screens,
 * `meta.roles` the roles that may open them; the guard in ./guard.ts enforces both.
 * The public board page (/b/:token) is its own chunk and pulls no component library.
 */
import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router';

const routes: RouteRecordRaw[] = [
  // Public, no sign-in.
  {
    path: '/b/:token',
    name: 'board-page',
    component: () => import('../views/public/BoardPageView.vue'),
    props: true,
    meta: { storeless: true },
  },
  { path: '/signin', name: 'signin', component: () => import('../views/auth/SignInView.vue') },
  { path: '/signup', name: 'signup', component: () => import('../views/auth/SignUpView.vue') },
  { path: '/signup/:token', name: 'confirm-signup', component: () => import('../views/auth/ConfirmSignUpView.vue'), props: true },
  { path: '/invite/:token', name: 'accept-invitation', component: () => import('../views/auth/AcceptInvitationView.vue'), props: true },
  { path: '/forgot', name: 'forgot-password', component: () => import('../views/auth/ForgotPasswordView.vue') },
  { path: '/reset/:token', name: 'reset-password', component: () => import('../views/auth/ResetPasswordView.vue'), props: true },
  // Signed in: inside the app shell.
  {
    path: '/',
    component: () => import('../components/app/AppShell.vue'),
    meta: { auth: true },
    children: [
      { path: '', name: 'home', redirect: { name: 'boards' } },
      { path: 'boards', name: 'boards', component: () => import('../views/boards/BoardsView.vue') },
      { path: 'boards/new', name: 'board-new', component: () => import('../views/boards/BoardNewView.vue'), meta: { roles: ['owner', 'electrician'] } },
      { path: 'boards/:id', name: 'board-editor', component: () => import('../views/boards/BoardEditorView.vue'), props: true },
      { path: 'boards/:id/history', name: 'board-history', component: () => import('../views/boards/BoardHistoryView.vue'), props: true },
      { path: 'boards/:id/print', name: 'board-print', component: () => import('../views/print/BoardPrintView.vue'), props: true },
      { path: 'boards/:id/page', name: 'board-sharing', component: () => import('../views/boards/BoardSharingView.vue'), props: true },
      { path: 'sites', name: 'sites', component: () => import('../views/sites/SitesView.vue') },
      { path: 'sites/:id', name: 'site', component: () => import('../views/sites/SiteView.vue'), props: true },
      { path: 'members', name: 'members', component: () => import('../views/settings/MembersView.vue'), meta: { roles: ['owner'] } },
      {
        path: 'settings/organisation',
        name: 'organisation-settings',
        component: () => import('../views/settings/OrganisationSettingsView.vue'),
        meta: { roles: ['owner'] },
      },
      { path: 'settings/printing', name: 'print-settings', component: () => import('../views/print/PrintSettingsView.vue') },
      { path: 'dev/mail', name: 'dev-mail', component: () => import('../views/settings/DevMailView.vue'), meta: { roles: ['owner'] } },
    ],
  },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('../views/NotFoundView.vue') },
];

export const router = createRouter({ history: createWebHistory(), routes });
