import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { Page, Role, UserSummary } from '@seinework/contracts';

export interface UserChange {
  role?: Role;
  active?: boolean;
}

/** `/api/admin/users`: who has an account, their role, whether they may sign in. */
@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly http = inject(HttpClient);

  list(page: number, pageSize: number): Observable<Page<UserSummary>> {
    return this.http.get<Page<UserSummary>>('/api/admin/users', { params: { page, pageSize } });
  }

  update(id: string, change: UserChange): Observable<unknown> {
    return this.http.patch(`/api/admin/users/${encodeURIComponent(id)}`, change);
  }
}
