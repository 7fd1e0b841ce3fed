import type { Routes } from '@angular/router';

export const AUDIT_ROUTES: Routes = [
  { path: '', loadComponent: () => import('./change-trail').then((m) => m.ChangeTrail) },
];
