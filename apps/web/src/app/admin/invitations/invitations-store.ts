import { inject } from '@angular/core';
import { patchState, signalStore, withMethods, withState } from '@ngrx/signals';
import { firstValueFrom } from 'rxjs';
import type { InvitationSummary, Role } from '@seinework/contracts';
import { problemMessage } from '../../auth/problem-message';
import { withPagedList } from '../paged-list';
import { InvitationsApi } from './invitations-api';

interface InvitingState {
  sending: boolean;
  /** What the last invite or revoke did, in a sentence. */
  outcome: string | null;
  problem: string | null;
}

export const InvitationsStore = signalStore(
  withPagedList<InvitationSummary>('invitations', () => {
    const api = inject(InvitationsApi);
    return (page, pageSize) => api.list(page, pageSize);
  }),
  withState<InvitingState>({ sending: false, outcome: null, problem: null }),
  withMethods((store, api = inject(InvitationsApi)) => ({
    /** Send an invitation; true when the server took it (the form then clears). */
    async invite(email: string, role: Role): Promise<boolean> {
      patchState(store, { sending: true, outcome: null, problem: null });
      try {
        await firstValueFrom(api.invite(email, role));
        patchState(store, { outcome: `An invitation is on its way to ${email}.` });
        await store.load();
        return true;
      } catch (error) {
        patchState(store, { problem: `The invitation was not sent: ${problemMessage(error)}` });
        return false;
      } finally {
        patchState(store, { sending: false });
      }
    },

    async revoke(invitation: InvitationSummary): Promise<void> {
      patchState(store, { outcome: null, problem: null });
      try {
        await firstValueFrom(api.revoke(invitation.id));
        patchState(store, { outcome: `The invitation to ${invitation.email} was revoked; its link no longer works.` });
      } catch (error) {
        patchState(store, { problem: `The invitation to ${invitation.email} was not revoked: ${problemMessage(error)}` });
      }
      await store.load();
    },
  })),
);
