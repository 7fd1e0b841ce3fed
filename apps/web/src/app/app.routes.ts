import type { Routes } from '@angular/router';
import { capabilityGuard, signedInGuard } from './core/auth/guards';
import { Shell } from './core/layout/shell';

/**
 * URLs and feature folders use different words on purpose. A URL names what a person sees and
 * shares (the navigation's words: a sweep, the overlay, the worklist, the change trail) and stays
 * put when code moves; a feature folder is named after the API resource its `*-api.ts` talks to
 * (`analysis`, `compare`, `assignments`, `audit`), as the API's own folders are. The pairs:
 *   /sweeps/:id -> features/analysis     /overlay -> features/compare
 *   /worklist   -> features/assignments  /trail   -> features/audit
 * Every other URL and folder share their word.
 */
export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Rhotrace',
    loadComponent: () => import('./features/access/sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: 'reset-password',
    title: 'New password · Rhotrace',
    loadComponent: () =>
      import('./features/access/reset-password/reset-password').then((m) => m.ResetPassword),
  },
  {
    path: '',
    component: Shell,
    canActivate: [signedInGuard],
    children: [
      {
        path: '',
        pathMatch: 'full',
        title: 'Bench · Rhotrace',
        loadComponent: () => import('./features/home/home').then((m) => m.Home),
      },
      {
        path: 'not-available',
        title: 'Not available · Rhotrace',
        loadComponent: () => import('./shared/not-available').then((m) => m.NotAvailable),
      },
      {
        path: 'lots',
        canMatch: [capabilityGuard('records:see-all')],
        loadChildren: () => import('./features/lots/lots.routes').then((m) => m.LOTS_ROUTES),
      },
      {
        path: 'wafers',
        loadChildren: () => import('./features/wafers/wafers.routes').then((m) => m.WAFERS_ROUTES),
      },
      {
        path: 'sweeps',
        canMatch: [capabilityGuard('fits:run')],
        data: { preloadFor: 'fits:run' },
        loadChildren: () =>
          import('./features/analysis/analysis.routes').then((m) => m.ANALYSIS_ROUTES),
      },
      {
        path: 'overlay',
        canMatch: [capabilityGuard('fits:run')],
        loadChildren: () =>
          import('./features/compare/compare.routes').then((m) => m.COMPARE_ROUTES),
      },
      {
        path: 'search',
        loadChildren: () => import('./features/search/search.routes').then((m) => m.SEARCH_ROUTES),
      },
      {
        path: 'worklist',
        canMatch: [capabilityGuard('assignments:assign')],
        loadChildren: () =>
          import('./features/assignments/assignments.routes').then((m) => m.ASSIGNMENTS_ROUTES),
      },
      {
        path: 'stations',
        canMatch: [capabilityGuard('records:see-all')],
        loadChildren: () =>
          import('./features/stations/stations.routes').then((m) => m.STATIONS_ROUTES),
      },
      {
        path: 'people',
        canMatch: [capabilityGuard('users:manage')],
        loadChildren: () => import('./features/people/people.routes').then((m) => m.PEOPLE_ROUTES),
      },
      {
        path: 'trail',
        canMatch: [capabilityGuard('audit:read')],
        loadChildren: () => import('./features/audit/audit.routes').then((m) => m.AUDIT_ROUTES),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];
