import type { Routes } from '@angular/router';

export const ANALYSIS_ROUTES: Routes = [
  {
    path: ':id',
    title: 'Sweep study · Rhotrace',
    // Fetched at idle after sign-in for the roles that study sweeps (see IdlePreloading).
    data: { preloadFor: 'fits:run' },
    loadComponent: () => import('./sweep-study/sweep-study').then((m) => m.SweepStudy),
  },
];
