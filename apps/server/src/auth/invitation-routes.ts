import { Router } from 'express';
import { acceptInvitationBodySchema, type CurrentUser, type Role } from '@seinework/contracts';
import type { Db } from '../db/database';
import { parseInput } from '../validate';
import { acceptInvitation, openInvitation } from './invitations';
import type { Sessions } from './session';

/** `GET /api/auth/invitations/:token` and `POST /api/auth/invitations/:token/accept` (no sign-in: the link is the credential). */
export function invitationRoutes({ db, sessions }: { db: Db; sessions: Sessions }): Router {
  const router = Router();

  router.get('/auth/invitations/:token', async (request, response) => {
    const invitation = await openInvitation(db, request.params.token, new Date());
    response.json({ email: invitation.email, role: invitation.role } satisfies { email: string; role: Role });
  });

  router.post('/auth/invitations/:token/accept', async (request, response) => {
    const body = parseInput(acceptInvitationBodySchema, request.body);
    const user = await acceptInvitation(db, { token: request.params.token, name: body.name, password: body.password, now: new Date() });
    const { cookie } = await sessions.create(user.id);
    response.append('Set-Cookie', cookie);
    response.json(user satisfies CurrentUser);
  });

  return router;
}
