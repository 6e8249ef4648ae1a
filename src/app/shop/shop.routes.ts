import type { Routes } from '@angular/router';

import { roleGuard } from '../core/role-guard';

export default [
  {
    path: '',
    pathMatch: 'full',
    title: 'Winding shop · Gapwright',
    loadComponent: () => import('./order-queue').then((m) => m.OrderQueue),
  },
  {
    path: 'accuracy',
    title: 'Measured versus predicted · Gapwright',
    canActivate: [roleGuard('predictionReport')],
    loadComponent: () => import('./prediction-accuracy').then((m) => m.PredictionAccuracy),
  },
  {
    path: 'orders/:id',
    title: 'Build order · Gapwright',
    loadComponent: () => import('./order-page').then((m) => m.OrderPage),
  },
] satisfies Routes;
