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
        path: 'admin',
        canActivate: [roleGuard(['admin'])],
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
