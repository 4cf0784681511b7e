import type { Routes } from '@angular/router';

export const discussionRoutes: Routes = [
  { path: '', loadComponent: () => import('./discussions-list').then((m) => m.DiscussionsList), title: 'Discussions — Seinework' },
  { path: ':optionId', loadComponent: () => import('./discussion-page').then((m) => m.DiscussionPage), title: 'Discussion — Seinework' },
];
