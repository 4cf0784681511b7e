import { inject } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { patchState, signalStore, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { CurrentUser } from '@seinework/contracts';
import { can, type Action } from '@seinework/contracts/permissions';
import { AuthApi } from './auth-api';
import { problemMessage } from './problem-message';

interface SessionState {
  /** The signed-in person, or null when nobody is signed in (or it is not known yet). */
  user: CurrentUser | null;
  /** Whether the server has been asked who is signed in (the guard waits for that once). */
  checked: boolean;
  loading: boolean;
  error: string | null;
  /** The server ended a session this page had (expired, signed out elsewhere, deactivated): sign-in says so. */
  ended: boolean;
}

/** Who is signed in, and what their role lets them do: the one source the guard, shell and pages read. */
export const SessionStore = signalStore(
  { providedIn: 'root' },
  withState<SessionState>({ user: null, checked: false, loading: false, error: null, ended: false }),
  withMethods((store, api = inject(AuthApi)) => {
    let pending: Promise<void> | null = null;

    /** Ask the server who is signed in (a 401 simply means nobody); concurrent callers share one request. */
    const load = (): Promise<void> => {
      pending ??= (async () => {
        patchState(store, { loading: true, error: null });
        try {
          patchState(store, { user: await firstValueFrom(api.me()) });
        } catch (error) {
          const signedOut = error instanceof HttpErrorResponse && error.status === 401;
          patchState(store, { user: null, error: signedOut ? null : problemMessage(error) });
        } finally {
          patchState(store, { loading: false, checked: true });
          pending = null;
        }
      })();
      return pending;
    };

    return {
      /** Whether the signed-in person's role allows an action (false when signed out). */
      can(action: Action): boolean {
        const user = store.user();
        return user !== null && can(user.role, action);
      },

      load,

      /** Ask the server once per page load, however many guards wait for it. */
      async ensureChecked(): Promise<void> {
        if (!store.checked()) await load();
      },

      /** Sign in; true when it worked, otherwise `error()` says why in plain words. */
      async signIn(email: string, password: string): Promise<boolean> {
        patchState(store, { loading: true, error: null });
        try {
          patchState(store, { user: await firstValueFrom(api.signIn(email, password)), checked: true, loading: false, ended: false });
          return true;
        } catch (error) {
          patchState(store, { user: null, loading: false, error: signInProblem(error) });
          return false;
        }
      },

      /** A session the server opened some other way (an accepted invitation). */
      signedInAs(user: CurrentUser): void {
        patchState(store, { user, checked: true, error: null, ended: false });
      },

      /** Forget the session here, whatever the server answers (it may already have expired). */
      async signOut(): Promise<void> {
        try {
          await firstValueFrom(api.signOut());
        } catch {
          // the session is gone either way; nothing for the person to do about it
        } finally {
          patchState(store, { user: null, checked: true, error: null });
        }
      },

      /** The server said the session is over (a 401 on some request). */
      sessionEnded(): void {
        patchState(store, { user: null, checked: true, ended: store.user() !== null || store.ended() });
      },
    };
  }),
);

function signInProblem(error: unknown): string {
  if (error instanceof HttpErrorResponse && error.status === 401) return 'That e-mail address and password do not match an active account.';
  return problemMessage(error);
}
