import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { AuditEvent, Page } from '@seinework/contracts';

/** `/api/admin/audit`: every change to data, who made it and when, newest first. */
@Injectable({ providedIn: 'root' })
export class AuditApi {
  private readonly http = inject(HttpClient);

  list(page: number, pageSize: number): Observable<Page<AuditEvent>> {
    return this.http.get<Page<AuditEvent>>('/api/admin/audit', { params: { page, pageSize } });
  }
}
