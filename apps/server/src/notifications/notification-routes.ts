import express, { Router, type Response } from 'express';
import { z } from 'zod';
import { notificationPreferencesSchema } from '@seinework/contracts';
import { currentUser, requireSignIn } from '../auth/guards';
import { parseInput } from '../validate';
import type { Notifications } from './notification-service';
import { confirmUnsubscribePage, UNSUBSCRIBE_PAGE_CSP, unknownLinkPage, unsubscribedPage } from './unsubscribe-page';

/**
 * `GET/PUT /api/me/notifications` (signed in: which notices one wants) and
 * `GET /api/notifications/unsubscribe?token=…` (public: the link in every notice, which asks) with
 * `POST /api/notifications/unsubscribe` (its button, form-encoded `token`, which does it), under /api.
 */

/** Where the unsubscribe page's button posts its form (the JSON reader lets this one address take a form). */
export const UNSUBSCRIBE_FORM_PATH = '/api/notifications/unsubscribe';

const unsubscribeToken = z.object({ token: z.string().max(200).optional() });

/** The pages are HTML for a person, from a link in a mail: no caching, and a referrer only to ourselves (a form post keeps its Origin). */
function sendPage(response: Response, status: number, html: string): void {
  response.set({ 'Content-Security-Policy': UNSUBSCRIBE_PAGE_CSP, 'Cache-Control': 'no-store', 'Referrer-Policy': 'same-origin' });
  response.status(status).type('html').send(html);
}

export function notificationRoutes(notifications: Notifications): Router {
  const router = Router();

  router.get('/me/notifications', requireSignIn, async (_request, response) => {
    response.json(await notifications.preferences(currentUser(response).id));
  });

  router.put('/me/notifications', requireSignIn, async (request, response) => {
    const body = parseInput(notificationPreferencesSchema, request.body);
    response.json(await notifications.setPreferences(currentUser(response).id, body));
  });

  // a link opened from an e-mail: no session; the token alone says who and what. Opening it only asks.
  router.get('/notifications/unsubscribe', async (request, response) => {
    const parsed = unsubscribeToken.safeParse(request.query);
    const token = parsed.success ? parsed.data.token : undefined;
    const link = token ? await notifications.unsubscribeLink(token) : null;
    if (!link) return sendPage(response, 404, unknownLinkPage());
    sendPage(response, 200, link.used ? unsubscribedPage(link) : confirmUnsubscribePage(link, token!));
  });

  // the page's button: the origin check has seen that it was posted from our own page
  router.post('/notifications/unsubscribe', express.urlencoded({ extended: false, limit: '2kb', parameterLimit: 5 }), async (request, response) => {
    const parsed = unsubscribeToken.safeParse(request.body ?? {});
    const token = parsed.success ? parsed.data.token : undefined;
    const outcome = token ? await notifications.unsubscribe(token) : null;
    sendPage(response, outcome ? 200 : 404, outcome ? unsubscribedPage(outcome) : unknownLinkPage());
  });

  return router;
}
