import { inject } from '@angular/core';
import { Router, type CanActivateFn, type Routes } from '@angular/router';
import { SessionStore } from '../auth/session-store';
import { landingPage } from '../auth/signed-in-guard';
import { PAGE_CARRIES_CAUTION } from '../shared/caution';

/** Whoever reads options (every option, or those shared with them) may compare them. */
const readsOptions: CanActivateFn = async () => {
  const session = inject(SessionStore);
  const router = inject(Router);
  await session.ensureChecked();
  if (session.can('options.read-all') || session.can('options.read-shared')) return true;
  return router.createUrlTree([landingPage(session.can('webs.read-published'))]);
};

/** The comparison of harvest options, loaded on first visit to /compare; `?runs=` is the whole state. */
export const compareRoutes: Routes = [
  { path: '', canActivate: [readsOptions], loadComponent: () => import('./compare-page').then((m) => m.ComparePage), title: 'Compare options — Seinework', data: PAGE_CARRIES_CAUTION },
];
