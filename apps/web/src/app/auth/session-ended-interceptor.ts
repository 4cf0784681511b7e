import { inject } from '@angular/core';
import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { SessionStore } from './session-store';
import { signInFirst } from './signed-in-guard';

/**
 * A 401 from any call means the session expired or was ended elsewhere: send the person to sign in,
 * and back to where they were afterwards. The session routes themselves answer 401 as part of their
 * job (wrong password, nobody signed in yet), so their pages handle it.
 */
export const sessionEndedInterceptor: HttpInterceptorFn = (request, next) => {
  const session = inject(SessionStore);
  const router = inject(Router);
  return next(request).pipe(
    catchError((error: unknown) => {
      if (error instanceof HttpErrorResponse && error.status === 401 && !isSessionRoute(request.url)) {
        session.sessionEnded();
        const here = router.url;
        if (!here.startsWith('/sign-in')) void router.navigateByUrl(signInFirst(router, here));
      }
      return throwError(() => error);
    }),
  );
};

function isSessionRoute(url: string): boolean {
  const path = url.replace(/^https?:\/\/[^/]+/, '');
  return path === '/api/me' || path.startsWith('/api/auth/');
}
