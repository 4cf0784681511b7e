import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { passwordResetBodySchema, passwordResetRequestBodySchema } from '@seinework/contracts';
import type { Db } from '../db/database';
import { RequestError } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { passwordResetMessage } from '../mail/messages';
import { parseInput } from '../validate';
import { createPasswordReset, resetPassword } from './password-resets';
import type { Sessions } from './session';

export interface PasswordResetRouteOptions {
  readonly db: Db;
  readonly sessions: Sessions;
  readonly mailer?: Mailer;
  readonly publicOrigin: string;
  /** Reset requests from one client address per 15 minutes (each account also gets at most 3 links an hour). */
  readonly requestsPerAddress?: number;
}

export const RESET_REQUESTS_PER_ADDRESS = 10;
const WINDOW_MINUTES = 15;

/** `POST /api/auth/password-reset` (ask for a link) and `POST /api/auth/password-reset/:token` (set the password). */
export function passwordResetRoutes(options: PasswordResetRouteOptions): Router {
  const { db, sessions, mailer, publicOrigin } = options;
  const router = Router();
  const perAddress = rateLimit({
    windowMs: WINDOW_MINUTES * 60_000,
    limit: options.requestsPerAddress ?? RESET_REQUESTS_PER_ADDRESS,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_request, _response, next) => next(new RequestError(429, `Too many password-reset requests from this address: wait ${WINDOW_MINUTES} minutes and try again`)),
  });

  router.post('/auth/password-reset', perAddress, (request, response) => {
    const { email } = parseInput(passwordResetRequestBodySchema, request.body);
    // Answer before looking the address up, so neither the answer nor its timing tells who has an account.
    response.status(202).json({ message: `If ${email} belongs to an active account, a link to choose a new password is on its way.` });
    void sendResetLink(email).catch((error: unknown) => console.error(`The password-reset link for ${email} was not sent:`, error instanceof Error ? error.message : error));
  });

  router.post('/auth/password-reset/:token', async (request, response) => {
    const body = parseInput(passwordResetBodySchema, request.body);
    const { userId, email } = await resetPassword(db, { token: request.params.token, password: body.password, now: new Date() });
    await sessions.invalidateUserSessions(userId);
    response.json({ email });
  });

  async function sendResetLink(email: string): Promise<void> {
    const reset = await createPasswordReset(db, { email, now: new Date() });
    if (!reset) return;
    if (!mailer) throw new Error('no mail server is set up (SMTP_URL)');
    await mailer.send(passwordResetMessage({ to: reset.to, name: reset.name, token: reset.token, publicOrigin, expiresAt: reset.expiresAt }));
  }

  return router;
}
