import type { Routes } from '@angular/router';

export const STATIONS_ROUTES: Routes = [
  { path: '', loadComponent: () => import('./station-list').then((m) => m.StationList) },
];
