import type { Routes } from '@angular/router';

export const ANALYSIS_ROUTES: Routes = [
  { path: '', loadComponent: () => import('./sweep-study').then((m) => m.SweepStudy) },
];
