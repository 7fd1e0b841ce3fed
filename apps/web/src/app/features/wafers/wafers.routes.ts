import type { Routes } from '@angular/router';

export const WAFERS_ROUTES: Routes = [
  { path: '', loadComponent: () => import('./wafer-page').then((m) => m.WaferPage) },
];
