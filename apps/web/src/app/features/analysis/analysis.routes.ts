import type { Routes } from '@angular/router';

export const ANALYSIS_ROUTES: Routes = [
  {
    path: ':id',
    title: 'Sweep study · Rhotrace',
    loadComponent: () => import('./sweep-study/sweep-study').then((m) => m.SweepStudy),
  },
];
