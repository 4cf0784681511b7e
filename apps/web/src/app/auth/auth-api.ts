import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { CurrentUser, Role } from '@seinework/contracts';

/** What an invitation link says before it is accepted. */
export interface InvitationPreview {
  readonly email: string;
  readonly role: Role;
}

/** The sign-in, session, invitation and password routes of the server (`/api/me`, `/api/auth/*`). */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  me(): Observable<CurrentUser> {
    return this.http.get<CurrentUser>('/api/me');
  }

  signIn(email: string, password: string): Observable<CurrentUser> {
    return this.http.post<CurrentUser>('/api/auth/sign-in', { email, password });
  }

  signOut(): Observable<unknown> {
    return this.http.post('/api/auth/sign-out', {});
  }

  changePassword(currentPassword: string, newPassword: string): Observable<unknown> {
    return this.http.post('/api/auth/change-password', { currentPassword, newPassword });
  }

  invitation(token: string): Observable<InvitationPreview> {
    return this.http.get<InvitationPreview>(`/api/auth/invitations/${encodeURIComponent(token)}`);
  }

  acceptInvitation(token: string, name: string, password: string): Observable<CurrentUser> {
    return this.http.post<CurrentUser>(`/api/auth/invitations/${encodeURIComponent(token)}/accept`, { name, password });
  }

  requestPasswordReset(email: string): Observable<unknown> {
    return this.http.post('/api/auth/password-reset', { email });
  }

  resetPassword(token: string, password: string): Observable<unknown> {
    return this.http.post(`/api/auth/password-reset/${encodeURIComponent(token)}`, { password });
  }
}
