import type { Routes } from '@angular/router';

export const COMPARE_ROUTES: Routes = [
  { path: '', loadComponent: () => import('./compare').then((m) => m.Compare) },
];
