import { Routes } from '@angular/router';

/** `/admin/*`: the data manager's pages (the parent route checks the role). */
export const adminRoutes: Routes = [
  {
    path: '',
    loadComponent: () => import('./admin-layout').then((m) => m.AdminLayout),
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'users' },
      { path: 'users', loadComponent: () => import('./users/users-page').then((m) => m.UsersPage), title: 'Users — Seinework' },
      { path: 'invitations', loadComponent: () => import('./invitations/invitations-page').then((m) => m.InvitationsPage), title: 'Invitations — Seinework' },
      { path: 'audit', loadComponent: () => import('./audit/audit-page').then((m) => m.AuditPage), title: 'Audit log — Seinework' },
      { path: 'outbox', loadComponent: () => import('./outbox/outbox-page').then((m) => m.OutboxPage), title: 'Outbox — Seinework' },
    ],
  },
];
