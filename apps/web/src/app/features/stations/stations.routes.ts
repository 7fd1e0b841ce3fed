import type { Routes } from '@angular/router';

export const STATIONS_ROUTES: Routes = [
  {
    path: '',
    title: 'Probe stations · Rhotrace',
    loadComponent: () => import('./station-list').then((m) => m.StationList),
  },
];
