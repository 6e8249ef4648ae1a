import type { Routes } from '@angular/router';

export default [
  { path: '', pathMatch: 'full', redirectTo: 'users' },
  {
    path: 'users',
    title: 'Users · Gapwright',
    loadComponent: () => import('./users/user-list').then((m) => m.UserList),
  },
  {
    path: 'audit',
    title: 'Audit log · Gapwright',
    loadComponent: () => import('./audit/audit-log').then((m) => m.AuditLog),
  },
  {
    path: 'outbox',
    title: 'Outbox · Gapwright',
    loadComponent: () => import('./outbox/outbox').then((m) => m.Outbox),
  },
  {
    path: 'settings',
    title: 'Settings · Gapwright',
    loadComponent: () => import('./settings/settings').then((m) => m.Settings),
  },
] satisfies Routes;
