import type { Routes } from '@angular/router';

export const ASSIGNMENTS_ROUTES: Routes = [
  {
    path: '',
    title: 'Worklist · Rhotrace',
    loadComponent: () => import('./worklist/worklist').then((m) => m.Worklist),
  },
];
