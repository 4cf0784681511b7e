import { Routes } from '@angular/router';
import { allowedTo, signedInGuard } from './auth/signed-in-guard';

export const routes: Routes = [
  // open to everyone: signing in, and the links sent by e-mail
  { path: 'sign-in', loadComponent: () => import('./auth/sign-in').then((m) => m.SignIn), title: 'Sign in — Seinework' },
  { path: 'invitation/:token', loadComponent: () => import('./auth/accept-invitation').then((m) => m.AcceptInvitation), title: 'Join Seinework' },
  { path: 'reset-password', loadComponent: () => import('./auth/reset-password-request').then((m) => m.ResetPasswordRequest), title: 'Reset your password — Seinework' },
  { path: 'reset-password/:token', loadComponent: () => import('./auth/reset-password').then((m) => m.ResetPassword), title: 'Choose a new password — Seinework' },
  // everything else is behind sign-in
  {
    path: '',
    canActivateChild: [signedInGuard],
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'webs' },
      { path: 'webs', canActivate: [allowedTo('webs.read-published')], loadChildren: () => import('./webs/webs-routes').then((m) => m.websRoutes) },
      { path: 'compare', loadChildren: () => import('./compare/compare-routes').then((m) => m.compareRoutes) },
      // the link in "a new comment on an option you follow" e-mails
      { path: 'options/:optionId/discussion', redirectTo: '/discussions/:optionId' },
      { path: 'options', loadChildren: () => import('./options/options-routes').then((m) => m.optionsRoutes) },
      { path: 'welcome', loadComponent: () => import('./shell/welcome').then((m) => m.Welcome), title: 'Welcome — Seinework' },
      { path: 'discussions', loadChildren: () => import('./discussion/discussion-routes').then((m) => m.discussionRoutes) },
      { path: 'runs', loadChildren: () => import('./results/results-routes').then((m) => m.resultsRoutes) },
      { path: 'account', loadComponent: () => import('./auth/account').then((m) => m.Account), title: 'Your account — Seinework' },
      { path: 'admin', canActivate: [allowedTo('users.manage')], loadChildren: () => import('./admin/admin.routes').then((m) => m.adminRoutes) },
      { path: 'brief', loadChildren: () => import('./brief/brief-routes').then((m) => m.briefRoutes) },
      { path: '**', redirectTo: 'webs' },
    ],
  },
];
