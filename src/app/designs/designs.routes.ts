import type { Routes } from '@angular/router';

import { roleGuard } from '../core/role-guard';

export default [
  {
    path: '',
    pathMatch: 'full',
    title: 'Designs · Gapwright',
    loadComponent: () => import('./design-list').then((m) => m.DesignList),
  },
  {
    path: 'new',
    title: 'New design · Gapwright',
    canActivate: [roleGuard('design')],
    loadComponent: () => import('./design-workspace').then((m) => m.DesignWorkspace),
  },
  {
    path: ':id',
    title: 'Design · Gapwright',
    loadComponent: () => import('./design-workspace').then((m) => m.DesignWorkspace),
  },
] satisfies Routes;
