import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { InvitationSummary, Page, Role } from '@seinework/contracts';

/** `/api/admin/invitations`: invite someone by e-mail with a role, list and revoke invitations. */
@Injectable({ providedIn: 'root' })
export class InvitationsApi {
  private readonly http = inject(HttpClient);

  list(page: number, pageSize: number): Observable<Page<InvitationSummary>> {
    return this.http.get<Page<InvitationSummary>>('/api/admin/invitations', { params: { page, pageSize } });
  }

  invite(email: string, role: Role): Observable<{ id: string }> {
    return this.http.post<{ id: string }>('/api/admin/invitations', { email, role });
  }

  revoke(id: string): Observable<unknown> {
    return this.http.delete(`/api/admin/invitations/${encodeURIComponent(id)}`);
  }
}
