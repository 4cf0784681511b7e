import { Router } from 'express';
import { z } from 'zod';
import { notificationPreferencesSchema } from '@seinework/contracts';
import { currentUser, requireSignIn } from '../auth/guards';
import { parseInput } from '../validate';
import type { Notifications } from './notification-service';
import { UNSUBSCRIBE_PAGE_CSP, unknownLinkPage, unsubscribedPage } from './unsubscribe-page';

/**
 * `GET/PUT /api/me/notifications` (signed in: which notices one wants) and
 * `GET /api/notifications/unsubscribe?token=…` (public: the link in every notice), under /api.
 */

const unsubscribeQuery = z.object({ token: z.string().max(200).optional() });

export function notificationRoutes(notifications: Notifications): Router {
  const router = Router();

  router.get('/me/notifications', requireSignIn, async (_request, response) => {
    response.json(await notifications.preferences(currentUser(response).id));
  });

  router.put('/me/notifications', requireSignIn, async (request, response) => {
    const body = parseInput(notificationPreferencesSchema, request.body);
    response.json(await notifications.setPreferences(currentUser(response).id, body));
  });

  // a link opened from an e-mail: no session, no Origin; the token alone says who and what
  router.get('/notifications/unsubscribe', async (request, response) => {
    const parsed = unsubscribeQuery.safeParse(request.query);
    const token = parsed.success ? parsed.data.token : undefined;
    const outcome = token ? await notifications.unsubscribe(token) : null;
    response.set({ 'Content-Security-Policy': UNSUBSCRIBE_PAGE_CSP, 'Cache-Control': 'no-store', 'Referrer-Policy': 'no-referrer' });
    response
      .status(outcome ? 200 : 404)
      .type('html')
      .send(outcome ? unsubscribedPage(outcome) : unknownLinkPage());
  });

  return router;
}
