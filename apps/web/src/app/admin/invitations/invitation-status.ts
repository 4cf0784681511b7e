import type { InvitationSummary } from '@seinework/contracts';

export type InvitationStatus = 'accepted' | 'expired' | 'waiting';

/** Where an invitation stands: accepted, past its expiry, or waiting for the person to open the link. */
export function invitationStatus(invitation: InvitationSummary, now: Date = new Date()): InvitationStatus {
  if (invitation.acceptedAt) return 'accepted';
  return new Date(invitation.expiresAt).getTime() <= now.getTime() ? 'expired' : 'waiting';
}

export const STATUS_LABELS: Readonly<Record<InvitationStatus, string>> = {
  accepted: 'Accepted',
  expired: 'Expired',
  waiting: 'Waiting',
};
