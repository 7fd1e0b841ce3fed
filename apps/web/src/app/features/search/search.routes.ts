import type { Routes } from '@angular/router';

export const SEARCH_ROUTES: Routes = [
  {
    path: '',
    title: 'Find · Rhotrace',
    loadComponent: () => import('./search-page').then((m) => m.SearchPage),
  },
];
