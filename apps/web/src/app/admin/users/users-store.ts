import { inject } from '@angular/core';
import { patchState, signalStore, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { UserSummary } from '@seinework/contracts';
import { problemMessage } from '../../auth/problem-message';
import { ROLE_LABELS } from '../../auth/role-label';
import { withPagedList } from '../paged-list';
import { UsersApi, type UserChange } from './users-api';

export const UsersStore = signalStore(
  withPagedList<UserSummary>('users', () => {
    const api = inject(UsersApi);
    return (page, pageSize) => api.list(page, pageSize);
  }),
  withState<{ savingId: string | null; saveProblem: string | null; saved: string | null }>({ savingId: null, saveProblem: null, saved: null }),
  withMethods((store, api = inject(UsersApi)) => ({
    /** Change a role or whether the person may sign in, then show the list as the server has it. */
    async update(user: UserSummary, change: UserChange): Promise<void> {
      patchState(store, { savingId: user.id, saveProblem: null, saved: null });
      try {
        await firstValueFrom(api.update(user.id, change));
        patchState(store, { saved: describe(user, change) });
      } catch (error) {
        patchState(store, { saveProblem: `${user.name} was not changed: ${problemMessage(error)}` });
      } finally {
        patchState(store, { savingId: null });
        await store.load();
      }
    },
  })),
);

function describe(user: UserSummary, change: UserChange): string {
  if (change.active === false) return `${user.name} can no longer sign in.`;
  if (change.active === true) return `${user.name} can sign in again.`;
  return change.role ? `${user.name}'s role is now ${ROLE_LABELS[change.role]}.` : `${user.name} was saved.`;
}
