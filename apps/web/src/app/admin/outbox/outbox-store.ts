import { inject } from '@angular/core';
import { signalStore } from '@ngrx/signals';
import type { OutboxMessage } from '@seinework/contracts';
import { withPagedList } from '../paged-list';
import { OutboxApi } from './outbox-api';

export const OutboxStore = signalStore(
  withPagedList<OutboxMessage>('outbox', () => {
    const api = inject(OutboxApi);
    return (page, pageSize) => api.list(page, pageSize);
  }),
);
