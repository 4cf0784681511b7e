import { randomUUID } from 'node:crypto';
import { and, count, desc, eq, isNull } from 'drizzle-orm';
import type { CurrentUser, InvitationSummary, Page, Role } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { invitations, users } from '../db/schema';
import { RequestError } from '../http/errors';
import { hashOneTimeToken, looksLikeOneTimeToken, newOneTimeToken } from './one-time-token';
import { hashPassword } from './passwords';

/**
 * Invitations: an admin invites an address with a role; the link's one-time token lets that person
 * choose their name and password, which creates their account. A link works once, until it expires
 * or is revoked; inviting the same address again revokes the earlier link.
 */

export const INVITATION_DAYS = 7;

type InvitationRow = typeof invitations.$inferSelect;

export interface NewInvitation {
  readonly id: string;
  readonly token: string;
  readonly expiresAt: Date;
}

export async function createInvitation(db: Db, input: { email: string; role: Role; invitedBy: CurrentUser; now: Date }): Promise<NewInvitation> {
  const { token, tokenHash } = newOneTimeToken();
  const id = randomUUID();
  const expiresAt = new Date(input.now.getTime() + INVITATION_DAYS * 86_400_000);
  await db.transaction(async (tx) => {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, input.email));
    if (existing) throw new RequestError(409, `${input.email} already has an account: change their role on the users page instead`);
    const replaced = await tx
      .update(invitations)
      .set({ revokedAt: input.now })
      .where(and(eq(invitations.email, input.email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
      .returning({ id: invitations.id });
    await tx.insert(invitations).values({ id, email: input.email, role: input.role, tokenHash, invitedBy: input.invitedBy.id, createdAt: input.now, expiresAt });
    const replacing = replaced.length > 0 ? ' (the earlier link no longer works)' : '';
    await recordAudit(tx, { actorId: input.invitedBy.id, action: 'invitation.sent', subject: `invitation:${id}`, detail: `Invited ${input.email} as ${input.role}${replacing}` });
  });
  return { id, token, expiresAt };
}

/** The invitations that were not revoked, newest first (accepted and expired ones included: the page shows their status). */
export async function listInvitations(db: Db, page: number, pageSize: number): Promise<Page<InvitationSummary>> {
  const [rows, [{ total }]] = await Promise.all([
    db
      .select({ invitation: invitations, invitedBy: users.name })
      .from(invitations)
      .innerJoin(users, eq(users.id, invitations.invitedBy))
      .where(isNull(invitations.revokedAt))
      .orderBy(desc(invitations.createdAt), desc(invitations.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db.select({ total: count() }).from(invitations).where(isNull(invitations.revokedAt)),
  ]);
  return {
    items: rows.map(({ invitation, invitedBy }) => ({
      id: invitation.id,
      email: invitation.email,
      role: invitation.role,
      invitedBy,
      createdAt: invitation.createdAt.toISOString(),
      expiresAt: invitation.expiresAt.toISOString(),
      acceptedAt: invitation.acceptedAt?.toISOString() ?? null,
    })),
    total,
  };
}

/** Revoking twice is not an error (the link is dead either way); an accepted invitation is past revoking. */
export async function revokeInvitation(db: Db, input: { id: string; by: CurrentUser; now: Date }): Promise<void> {
  await db.transaction(async (tx) => {
    const [invitation] = await tx.select().from(invitations).where(eq(invitations.id, input.id)).for('update');
    if (!invitation) throw new RequestError(404, 'No such invitation');
    if (invitation.acceptedAt) throw new RequestError(409, `${invitation.email} already accepted this invitation: deactivate the account on the users page instead`);
    if (invitation.revokedAt) return;
    await tx.update(invitations).set({ revokedAt: input.now }).where(eq(invitations.id, input.id));
    await recordAudit(tx, { actorId: input.by.id, action: 'invitation.revoked', subject: `invitation:${input.id}`, detail: `Revoked the invitation of ${invitation.email} (${invitation.role})` });
  });
}

/** The invitation a link's token opens, or a 404 / 410 saying why it does not work. */
export async function openInvitation(db: Db, token: string, now: Date): Promise<InvitationRow> {
  const [invitation] = looksLikeOneTimeToken(token) ? await db.select().from(invitations).where(eq(invitations.tokenHash, hashOneTimeToken(token))) : [];
  return usable(invitation, now);
}

/**
 * Creates the invited person's account and marks the invitation used, in one transaction that
 * locks the invitation, so two people racing with the same link cannot both get an account.
 */
export async function acceptInvitation(db: Db, input: { token: string; name: string; password: string; now: Date }): Promise<CurrentUser> {
  // Fail fast on a dead link before paying for the password hash.
  await openInvitation(db, input.token, input.now);
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const [locked] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hashOneTimeToken(input.token))).for('update');
    const invitation = usable(locked, input.now);
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, invitation.email));
    if (existing) throw new RequestError(409, `${invitation.email} already has an account: sign in, or reset your password`);
    const id = randomUUID();
    await tx.insert(users).values({ id, email: invitation.email, name: input.name, role: invitation.role, passwordHash });
    await tx.update(invitations).set({ acceptedAt: input.now }).where(eq(invitations.id, invitation.id));
    await recordAudit(tx, { actorId: id, action: 'invitation.accepted', subject: `invitation:${invitation.id}`, detail: `${invitation.email} accepted the invitation as ${invitation.role}` });
    await recordAudit(tx, { actorId: id, action: 'user.created', subject: `user:${id}`, detail: `${input.name} <${invitation.email}> (${invitation.role}), by invitation` });
    return { id, email: invitation.email, name: input.name, role: invitation.role };
  });
}

function usable(invitation: InvitationRow | undefined, now: Date): InvitationRow {
  if (!invitation) throw new RequestError(404, 'This invitation link is not known: check that the whole link was copied, or ask for a new invitation');
  if (invitation.acceptedAt) throw new RequestError(410, 'This invitation link has already been used: sign in instead');
  if (invitation.revokedAt) throw new RequestError(410, 'This invitation was withdrawn: ask an administrator for a new one');
  if (invitation.expiresAt.getTime() <= now.getTime()) throw new RequestError(410, 'This invitation link has expired: ask an administrator to invite you again');
  return invitation;
}
