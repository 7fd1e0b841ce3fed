import type { Routes } from '@angular/router';
import { capabilityGuard } from '../../core/auth/guards';

export const LOTS_ROUTES: Routes = [
  {
    path: '',
    title: 'Lots · Rhotrace',
    loadComponent: () => import('./lot-list/lot-list').then((m) => m.LotList),
  },
  {
    path: 'new',
    title: 'Register a lot · Rhotrace',
    canMatch: [capabilityGuard('records:edit')],
    loadComponent: () => import('./lot-form/lot-form').then((m) => m.LotForm),
  },
  {
    path: ':id/edit',
    title: 'Edit lot · Rhotrace',
    canMatch: [capabilityGuard('records:edit')],
    loadComponent: () => import('./lot-form/lot-form').then((m) => m.LotForm),
  },
  {
    path: ':id',
    title: 'Lot · Rhotrace',
    loadComponent: () => import('./lot-detail/lot-detail').then((m) => m.LotDetail),
  },
];
