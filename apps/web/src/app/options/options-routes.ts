import type { Routes } from '@angular/router';
import { allowedTo } from '../auth/signed-in-guard';
import { unsavedChangesGuard } from '../webs/unsaved-changes-guard';
import { PAGE_CARRIES_CAUTION } from '../shared/caution';

/** The harvest-options feature, loaded on first visit to /options. */
export const optionsRoutes: Routes = [
  { path: 'new', canActivate: [allowedTo('options.edit')], canDeactivate: [unsavedChangesGuard], loadComponent: () => import('./option-form').then((m) => m.OptionForm), title: 'New harvest option — Seinework', data: PAGE_CARRIES_CAUTION },
  { path: ':id', loadComponent: () => import('./option-page').then((m) => m.OptionPage), title: 'Harvest option — Seinework', data: PAGE_CARRIES_CAUTION },
  { path: ':id/edit', canActivate: [allowedTo('options.edit')], canDeactivate: [unsavedChangesGuard], loadComponent: () => import('./option-form').then((m) => m.OptionForm), title: 'Edit a harvest option — Seinework', data: PAGE_CARRIES_CAUTION },
];
