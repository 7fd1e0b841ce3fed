import type { Routes } from '@angular/router';

export const PEOPLE_ROUTES: Routes = [
  { path: '', loadComponent: () => import('./people-list').then((m) => m.PeopleList) },
];
