import type { Routes } from '@angular/router';

export const AUDIT_ROUTES: Routes = [
  {
    path: '',
    title: 'Change trail · Rhotrace',
    loadComponent: () => import('./change-trail').then((m) => m.ChangeTrail),
  },
];
