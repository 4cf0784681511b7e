import { Router } from 'express';
import { z } from 'zod';
import { invitationBodySchema } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import { currentUser, requireAction } from '../auth/guards';
import { createInvitation, listInvitations, revokeInvitation } from '../auth/invitations';
import type { Db } from '../db/database';
import { RequestError } from '../http/errors';
import { MailError, type Mailer } from '../mail/mailer';
import { invitationMessage } from '../mail/messages';
import { parseInput } from '../validate';
import { pageQuerySchema } from './page-query';

const invitationIdSchema = z.strictObject({ id: z.string().min(1).max(100) });

export interface AdminInvitationRouteOptions {
  readonly db: Db;
  /** Absent when no mail server is set up: invitations are kept, and the admin is told none was sent. */
  readonly mailer?: Mailer;
  readonly publicOrigin: string;
}

/** `POST /api/admin/invitations`, `GET /api/admin/invitations`, `DELETE /api/admin/invitations/:id` (users.manage). */
export function adminInvitationRoutes({ db, mailer, publicOrigin }: AdminInvitationRouteOptions): Router {
  const router = Router();

  router.post('/invitations', requireAction('users.manage'), async (request, response) => {
    const body = parseInput(invitationBodySchema, request.body);
    const me = currentUser(response);
    const invitation = await createInvitation(db, { email: body.email, role: body.role, invitedBy: me, now: new Date() });
    try {
      if (!mailer) throw new MailError('no mail server is set up (SMTP_URL)');
      await mailer.send(invitationMessage({ to: body.email, role: body.role, invitedBy: me.name, token: invitation.token, publicOrigin, expiresAt: invitation.expiresAt }));
    } catch (error) {
      if (!(error instanceof MailError)) throw error;
      // The invitation stays stored (and listed); inviting the address again sends a fresh link.
      await recordAudit(db, { actorId: me.id, action: 'invitation.not-delivered', subject: `invitation:${invitation.id}`, detail: error.message });
      throw new RequestError(502, `The invitation to ${body.email} was saved but its e-mail could not be sent (${error.message}). Invite the address again to send a new link.`);
    }
    response.status(201).json({ id: invitation.id });
  });

  router.get('/invitations', requireAction('users.manage'), async (request, response) => {
    const { page, pageSize } = parseInput(pageQuerySchema, request.query, 'query');
    response.json(await listInvitations(db, page, pageSize));
  });

  router.delete('/invitations/:id', requireAction('users.manage'), async (request, response) => {
    const { id } = parseInput(invitationIdSchema, request.params, 'address');
    await revokeInvitation(db, { id, by: currentUser(response), now: new Date() });
    response.status(204).end();
  });

  return router;
}
