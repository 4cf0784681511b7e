import { Injectable, inject } from '@angular/core';
import { HttpClient } from '@angular/common/http';
import type { Observable } from 'rxjs';
import type { OutboxMessage, Page } from '@seinework/contracts';

/** `/api/admin/outbox`: the messages the local mail catcher received (demo mode). */
@Injectable({ providedIn: 'root' })
export class OutboxApi {
  private readonly http = inject(HttpClient);

  list(page: number, pageSize: number): Observable<Page<OutboxMessage>> {
    return this.http.get<Page<OutboxMessage>>('/api/admin/outbox', { params: { page, pageSize } });
  }
}
