import type { Routes } from '@angular/router';

export const COMPARE_ROUTES: Routes = [
  {
    path: '',
    title: 'Overlay · Rhotrace',
    loadComponent: () => import('./compare').then((m) => m.Compare),
  },
];
