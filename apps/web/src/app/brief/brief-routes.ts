import type { Routes } from '@angular/router';
import { allowedTo } from '../auth/signed-in-guard';
import { PAGE_CARRIES_CAUTION } from '../shared/caution';

/** The print pages of briefs, loaded on first visit to /brief (briefs.read: analysts, staff, admins). */
export const briefRoutes: Routes = [
  { path: 'options/:id', canActivate: [allowedTo('briefs.read')], loadComponent: () => import('./option-brief').then((m) => m.OptionBrief), title: 'Brief — Seinework', data: PAGE_CARRIES_CAUTION },
  { path: 'compare', canActivate: [allowedTo('briefs.read')], loadComponent: () => import('./comparison-brief').then((m) => m.ComparisonBrief), title: 'Comparison brief — Seinework', data: PAGE_CARRIES_CAUTION },
];
