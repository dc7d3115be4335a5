/** Every view is reached through these routes; the guard applies sign-in and roles. */
import { createRouter, createWebHistory, type RouteLocationNormalized, type RouteRecordRaw } from 'vue-router';
import type { Role } from '../../shared/schemas/users.js';
import { setUnauthorizedHandler } from '../api/http.js';
import { getRun } from '../api/runs.js';
import { useAuthStore } from '../stores/auth.js';
import { decideNavigation, SIGN_IN } from './guard.js';

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: boolean;
    /** Least role that may open the page. */
    minRole?: Role;
    /** 'bare': no app bar or drawer (sign-in). */
    layout?: 'bare';
    title?: string;
  }
}

/** `/runs/:id` (the link in review e-mails): open the run's model on its review tab. */
async function openRunLink(to: RouteLocationNormalized) {
  try {
    const run = await getRun(Number(to.params.runId));
    return { name: 'model', params: { id: run.modelId }, query: { run: run.id, tab: 'review' } };
  } catch {
    return true; // shows "not found"
  }
}

const routes: RouteRecordRaw[] = [
  { path: '/', redirect: { name: 'projects' } },
  { path: '/sign-in', name: 'sign-in', component: () => import('../views/SignInView.vue'), meta: { public: true, layout: 'bare', title: 'Sign in' } },
  { path: '/projects', name: 'projects', component: () => import('../views/ProjectsView.vue'), meta: { title: 'Projects' } },
  { path: '/projects/:id(\\d+)', name: 'project', component: () => import('../views/ProjectView.vue'), props: (r) => ({ id: Number(r.params.id) }), meta: { title: 'Project' } },
  { path: '/projects/:id(\\d+)/import', name: 'import', component: () => import('../views/ImportView.vue'), props: (r) => ({ id: Number(r.params.id), modelId: r.query.modelId ? Number(r.query.modelId) : null }), meta: { minRole: 'engineer', title: 'Import' } },
  { path: '/models/:id(\\d+)', name: 'model', component: () => import('../views/ModelView.vue'), props: (r) => ({ id: Number(r.params.id) }), meta: { title: 'Model' } },
  { path: '/models/:id(\\d+)/compare', name: 'compare', component: () => import('../views/RunCompareView.vue'), props: (r) => ({ id: Number(r.params.id), a: Number(r.query.a), b: Number(r.query.b) }), meta: { title: 'Compare runs' } },
  { path: '/runs/:runId(\\d+)/members/:member', name: 'member', component: () => import('../views/MemberDetailView.vue'), props: (r) => ({ runId: Number(r.params.runId), member: String(r.params.member), loading: typeof r.query.loading === 'string' ? r.query.loading : null }), meta: { title: 'Member' } },
  { path: '/runs/:runId(\\d+)', name: 'run', component: () => import('../views/NotFoundView.vue'), beforeEnter: openRunLink, meta: { title: 'Run' } },
  { path: '/audit', name: 'audit', component: () => import('../views/AuditView.vue'), meta: { minRole: 'lead', title: 'Audit trail' } },
  { path: '/outbox', name: 'outbox', component: () => import('../views/OutboxView.vue'), meta: { title: 'Mail' } },
  { path: '/set-password', name: 'set-password', component: () => import('../views/SetPasswordView.vue'), meta: { public: true, layout: 'bare', title: 'Choose a password' } },
  { path: '/forgot-password', name: 'forgot-password', component: () => import('../views/ForgotPasswordView.vue'), meta: { public: true, layout: 'bare', title: 'Forgot password' } },
  { path: '/admin/users', name: 'admin-users', component: () => import('../views/AdminUsersView.vue'), meta: { minRole: 'admin', title: 'Users' } },
  { path: '/help/conventions', name: 'conventions', component: () => import('../views/ConventionsView.vue'), meta: { public: true, title: 'Axes, signs and units' } },
  { path: '/about', name: 'about', component: () => import('../views/AboutView.vue'), meta: { public: true, title: 'About' } },
  { path: '/not-allowed', name: 'forbidden', component: () => import('../views/NotFoundView.vue'), props: { reason: 'forbidden' }, meta: { title: 'Not allowed' } },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('../views/NotFoundView.vue'), meta: { public: true, title: 'Not found' } },
];

export const router = createRouter({ history: createWebHistory(), routes });

router.beforeEach(async (to) => {
  const auth = useAuthStore();
  await auth.fetchMe();
  const decision = decideNavigation(to, auth.user);
  return decision.kind === 'allow' ? true : decision.to;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Trestle` : 'Trestle';
});

// A 401 from any call means the session ended: forget the user and go to sign-in.
setUnauthorizedHandler(() => {
  const auth = useAuthStore();
  auth.forget();
  const here = router.currentRoute.value;
  if (here.name !== SIGN_IN) void router.push({ name: SIGN_IN, query: { redirect: here.fullPath } });
});
