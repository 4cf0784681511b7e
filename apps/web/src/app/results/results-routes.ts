import type { Routes } from '@angular/router';

/** The result page of a run, loaded on first visit to /runs/:id. */
export const resultsRoutes: Routes = [
  { path: ':id', loadComponent: () => import('./result-page').then((m) => m.ResultPage), title: 'Result — Seinework' },
  { path: '', pathMatch: 'full', redirectTo: '/webs' },
];
