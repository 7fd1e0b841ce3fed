import type { Routes } from '@angular/router';

export const PEOPLE_ROUTES: Routes = [
  {
    path: '',
    title: 'People · Rhotrace',
    loadComponent: () => import('./people-list').then((m) => m.PeopleList),
  },
];
