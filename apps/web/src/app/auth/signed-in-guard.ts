import { inject } from '@angular/core';
import { Router, type CanActivateFn, type UrlTree } from '@angular/router';
import type { Action } from '@seinework/contracts';
import { SessionStore } from './session-store';

/** Pages behind sign-in: someone signed out goes to /sign-in and comes back here afterwards. */
export const signedInGuard: CanActivateFn = async (_route, state) => {
  // inject before waiting: the injection context ends at the first await
  const session = inject(SessionStore);
  const router = inject(Router);
  await session.ensureChecked();
  return session.user() ? true : signInFirst(router, state.url);
};

/** Pages for one action (the admin pages, the webs): others are sent to their own landing page. */
export function allowedTo(action: Action): CanActivateFn {
  return async (_route, state) => {
    const session = inject(SessionStore);
    const router = inject(Router);
    await session.ensureChecked();
    if (!session.user()) return signInFirst(router, state.url);
    return session.can(action) ? true : router.createUrlTree([landingPage(session.can('webs.read-published'))]);
  };
}

/** The first page of a role: the list of webs, or the welcome page for a role that reads none. */
export function landingPage(readsWebs: boolean): string {
  return readsWebs ? '/webs' : '/welcome';
}

export function signInFirst(router: Router, returnTo: string): UrlTree {
  return router.createUrlTree(['/sign-in'], { queryParams: returnTo && returnTo !== '/' ? { returnTo } : {} });
}

/** Only addresses inside the app are followed after sign-in (never another site). */
export function safeReturnTo(returnTo: string | null | undefined): string {
  return returnTo && returnTo.startsWith('/') && !returnTo.startsWith('//') && !returnTo.startsWith('/\\') ? returnTo : '/webs';
}
