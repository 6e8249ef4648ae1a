import type { Routes } from '@angular/router';

import { authGuard } from './core/auth-guard';
import { roleGuard } from './core/role-guard';
import { signedOutGuard } from './core/signed-out-guard';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Gapwright',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: '',
    canActivate: [authGuard],
    children: [
      {
        path: '',
        pathMatch: 'full',
        title: 'Home · Gapwright',
        loadComponent: () => import('./home/home').then((m) => m.Home),
      },
      {
        path: 'account',
        title: 'My account · Gapwright',
        loadComponent: () => import('./account/account').then((m) => m.Account),
      },
      {
        path: 'materials',
        title: 'Materials · Gapwright',
        canActivate: [roleGuard('library')],
        loadComponent: () => import('./materials/material-library').then((m) => m.MaterialLibrary),
      },
      {
        path: 'materials/:id/loss-points',
        title: 'Loss points · Gapwright',
        canActivate: [roleGuard('library')],
        loadComponent: () => import('./materials/loss-points-page').then((m) => m.LossPointsPage),
      },
      {
        path: 'cores',
        title: 'Cores · Gapwright',
        canActivate: [roleGuard('library')],
        loadComponent: () => import('./cores/core-catalogue').then((m) => m.CoreCatalogue),
      },
      {
        path: 'compare',
        title: 'Compare materials · Gapwright',
        canActivate: [roleGuard('library')],
        loadComponent: () => import('./compare/material-compare').then((m) => m.MaterialCompare),
      },
      {
        path: 'designs',
        loadChildren: () => import('./designs/designs.routes'),
      },
      {
        path: 'inbox',
        title: 'Waiting for me · Gapwright',
        loadComponent: () => import('./inbox/inbox-page').then((m) => m.InboxPage),
      },
      {
        path: 'review',
        title: 'Review and release · Gapwright',
        canActivate: [roleGuard('review')],
        loadComponent: () => import('./review/review-page').then((m) => m.ReviewPage),
      },
      {
        path: 'review/revisions/:id',
        title: 'Revision review · Gapwright',
        canActivate: [roleGuard('library')],
        loadComponent: () => import('./review/revision-page').then((m) => m.RevisionPage),
      },
      {
        path: 'shop',
        canActivate: [roleGuard('shop')],
        loadChildren: () => import('./shop/shop.routes'),
      },
      {
        path: 'admin',
        canActivate: [roleGuard('admin')],
        loadChildren: () => import('./admin/admin.routes'),
      },
    ],
  },
  {
    path: '**',
    title: 'Page not found · Gapwright',
    loadComponent: () => import('./not-found/not-found').then((m) => m.NotFound),
  },
];
