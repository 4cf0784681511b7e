import { Routes } from '@angular/router';

export const routes: Routes = [
  { path: '', loadComponent: () => import('./baselines/baseline-overview').then((m) => m.BaselineOverview), title: 'Seinework — baseline' },
  { path: '**', redirectTo: '' },
];
