import type { Routes } from '@angular/router';

export const ASSIGNMENTS_ROUTES: Routes = [
  { path: '', loadComponent: () => import('./worklist').then((m) => m.Worklist) },
];
