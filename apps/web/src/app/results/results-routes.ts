import type { Routes } from '@angular/router';
import { PAGE_CARRIES_CAUTION } from '../shared/caution';

/** The result page of a run, loaded on first visit to /runs/:id. */
export const resultsRoutes: Routes = [
  { path: ':id', loadComponent: () => import('./result-page').then((m) => m.ResultPage), title: 'Result — Seinework', data: PAGE_CARRIES_CAUTION },
  { path: '', pathMatch: 'full', redirectTo: '/webs' },
];
