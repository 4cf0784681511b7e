import { inject } from '@angular/core';
import { signalStore } from '@ngrx/signals';
import type { AuditEvent } from '@seinework/contracts';
import { withPagedList } from '../paged-list';
import { AuditApi } from './audit-api';

export const AuditStore = signalStore(
  withPagedList<AuditEvent>('audit log', () => {
    const api = inject(AuditApi);
    return (page, pageSize) => api.list(page, pageSize);
  }),
);
