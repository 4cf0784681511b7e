import type { Routes } from '@angular/router';
import { allowedTo } from '../auth/signed-in-guard';
import { unsavedChangesGuard } from './unsaved-changes-guard';

/** The webs feature, loaded on first visit to /webs. */
export const websRoutes: Routes = [
  { path: '', loadComponent: () => import('./web-list').then((m) => m.WebList), title: 'Webs — Seinework' },
  { path: 'upload', canActivate: [allowedTo('webs.create')], loadComponent: () => import('./upload-page').then((m) => m.UploadPage), title: 'Upload a web — Seinework' },
  { path: ':id', loadComponent: () => import('./web-page').then((m) => m.WebPage), title: 'Web — Seinework' },
  {
    path: ':id/versions/:versionId/edit',
    canActivate: [allowedTo('webs.edit')],
    canDeactivate: [unsavedChangesGuard],
    loadComponent: () => import('./flow-editor').then((m) => m.FlowEditor),
    title: 'Edit a web — Seinework',
  },
];
