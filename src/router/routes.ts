import type { RouteRecordRaw } from 'vue-router';
import type { Action, SubjectName } from '@shared/abilities';

declare module 'vue-router' {
  interface RouteMeta {
    /** Shown in the tab title and the top bar. */
    title: string;
    /** Open without signing in. */
    public?: boolean;
    /** Signed-in people are sent home instead (the sign-in page itself). */
    guestOnly?: boolean;
    /** What the person's ability must allow to open the page. */
    can?: readonly [Action, SubjectName];
  }
}

/** Every page, lazy-loaded. A new feature adds its line here and, if it has one, a line in navigation.ts. */
export const routes: RouteRecordRaw[] = [
  { path: '/sign-in', name: 'sign-in', component: () => import('@/views/SignInView.vue'), meta: { title: 'Sign in', public: true, guestOnly: true } },
  { path: '/forgot-password', name: 'forgot-password', component: () => import('@/views/ForgotPasswordView.vue'), meta: { title: 'Forgotten password', public: true, guestOnly: true } },
  { path: '/set-password', name: 'set-password', component: () => import('@/views/SetPasswordView.vue'), meta: { title: 'Set your password', public: true } },
  { path: '/', name: 'home', component: () => import('@/views/HomeView.vue'), meta: { title: 'Home' } },
  { path: '/profile', name: 'profile', component: () => import('@/views/ProfileView.vue'), meta: { title: 'Your account' } },
  { path: '/people', name: 'people', component: () => import('@/views/PeopleView.vue'), meta: { title: 'People', can: ['invite', 'User'] } },
  { path: '/outbox', name: 'outbox', component: () => import('@/views/OutboxView.vue'), meta: { title: 'Outgoing mail', can: ['read', 'MailLog'] } },
  { path: '/benches', name: 'benches', component: () => import('@/views/BenchesView.vue'), meta: { title: 'Benches', can: ['read', 'Bench'] } },
  { path: '/instruments', name: 'instruments', component: () => import('@/views/InstrumentsView.vue'), meta: { title: 'Test instruments', can: ['read', 'Instrument'] } },
  { path: '/calculator', name: 'calculator', component: () => import('@/views/CalculatorView.vue'), meta: { title: 'Bench calculator' } },
  { path: '/procedures', name: 'procedures', component: () => import('@/views/ProceduresView.vue'), meta: { title: 'Procedures', can: ['read', 'Procedure'] } },
  { path: '/procedures/:id', name: 'procedure', component: () => import('@/views/ProcedureView.vue'), meta: { title: 'Procedure history', can: ['read', 'Procedure'] } },
  { path: '/procedures/:id/compare', name: 'procedure-compare', component: () => import('@/views/ProcedureCompareView.vue'), meta: { title: 'Compare versions', can: ['read', 'Procedure'] } },
  { path: '/procedures/:id/versions/:versionId', name: 'procedure-version', component: () => import('@/views/ProcedureVersionView.vue'), meta: { title: 'Procedure', can: ['read', 'Procedure'] } },
  { path: '/procedures/:id/versions/:versionId/edit', name: 'procedure-edit', component: () => import('@/views/ProcedureEditView.vue'), meta: { title: 'Edit a procedure', can: ['update', 'Procedure'] } },
  { path: '/register', name: 'register', component: () => import('@/views/RegisterView.vue'), meta: { title: 'Register', can: ['read', 'Register'] } },
  { path: '/register/matrix', name: 'register-matrix', component: () => import('@/views/RegisterMatrixView.vue'), meta: { title: 'People by scope', can: ['read', 'Register'] } },
  { path: '/overview', name: 'overview', component: () => import('@/views/OverviewView.vue'), meta: { title: 'Overview', can: ['read', 'Overview'] } },
  { path: '/audit', name: 'audit-trail', component: () => import('@/views/AuditTrailView.vue'), meta: { title: 'Audit trail', can: ['read', 'AuditLog'] } },
  { path: '/findings', name: 'findings', component: () => import('@/views/FindingsView.vue'), meta: { title: 'Findings', can: ['read', 'Finding'] } },
  { path: '/incident-pack', name: 'incident-pack', component: () => import('@/views/IncidentPackView.vue'), meta: { title: 'Incident pack', can: ['read', 'Register'] } },
  { path: '/people/:id/record', name: 'person-record', component: () => import('@/views/PersonRecordView.vue'), meta: { title: 'Person record', can: ['read', 'PersonRecord'] } },
  { path: '/my-record', name: 'my-record', component: () => import('@/views/PersonRecordView.vue'), meta: { title: 'Everything on record about you', can: ['read', 'PersonRecord'] } },
  { path: '/records', name: 'my-records', component: () => import('@/views/MyRecordsView.vue'), meta: { title: 'My sign-offs and practicals', can: ['create', 'Signoff'] } },
  { path: '/records/site', name: 'site-records', component: () => import('@/views/SiteRecordsView.vue'), meta: { title: 'Sign-offs and practicals at your sites', can: ['review', 'Signoff'] } },
  { path: '/signoffs/:id', name: 'signoff', component: () => import('@/views/SignoffView.vue'), meta: { title: 'Sign-off', can: ['read', 'Signoff'] } },
  { path: '/practicals/new', name: 'practical-new', component: () => import('@/views/PracticalNewView.vue'), meta: { title: 'Open a practical', can: ['create', 'Practical'] } },
  { path: '/practicals/:id', name: 'practical', component: () => import('@/views/PracticalView.vue'), meta: { title: 'Practical', can: ['read', 'Practical'] } },
  { path: '/authorisations/mine', name: 'my-authorisations', component: () => import('@/views/AuthorisationsMineView.vue'), meta: { title: 'What I may do', can: ['read', 'Authorisation'] } },
  { path: '/authorisations/due', name: 'authorisations-due', component: () => import('@/views/AuthorisationsDueView.vue'), meta: { title: 'Due for renewal', can: ['update', 'Authorisation'] } },
  { path: '/authorisations/prior', name: 'authorisations-prior', component: () => import('@/views/AuthorisationPriorView.vue'), meta: { title: 'Authorisations held before the portal', can: ['create', 'Authorisation'] } },
  { path: '/authorisations/:id', name: 'authorisation', component: () => import('@/views/AuthorisationView.vue'), meta: { title: 'Authorisation', can: ['read', 'Authorisation'] } },
  { path: '/scopes', name: 'scopes', component: () => import('@/views/ScopesView.vue'), meta: { title: 'Authorisation scopes', can: ['read', 'Scope'] } },
  { path: '/eligibility/:personId?', name: 'eligibility', component: () => import('@/views/EligibilityView.vue'), meta: { title: 'What each scope needs', can: ['read', 'Authorisation'] } },
  { path: '/certificates', name: 'certificates', component: () => import('@/views/CertificatesView.vue'), meta: { title: 'Certificates', can: ['read', 'Certificate'] } },
  { path: '/verify/:code', name: 'verify', component: () => import('@/views/VerifyView.vue'), meta: { title: 'Check an authorisation', public: true } },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/views/NotFoundView.vue'), meta: { title: 'Page not found' } },
];
