import type { Routes } from '@angular/router';

export const WAFERS_ROUTES: Routes = [
  {
    path: ':id',
    title: 'Wafer · Rhotrace',
    loadComponent: () => import('./wafer-page/wafer-page').then((m) => m.WaferPage),
  },
];
