import type { Express } from 'express';
import { adminInvitationRoutes } from '../admin/invitation-routes';
import { adminOutboxRoutes } from '../admin/outbox-routes';
import { invitationRoutes } from '../auth/invitation-routes';
import { passwordResetRoutes } from '../auth/password-reset-routes';
import type { Sessions } from '../auth/session';
import type { Db } from '../db/database';
import type { Mailer } from './mailer';

export interface MailRouteSettings {
  readonly db: Db;
  /** db-auth's sessions: accepting an invitation signs the person in, a reset signs them out everywhere. */
  readonly sessions: Sessions;
  readonly mailer?: Mailer;
  /** The start of every link in e-mail. */
  readonly publicOrigin: string;
}

/** The routes that send e-mail or read what was sent: invitations, password resets, the outbox. */
export function mountMailRoutes(app: Express, settings: MailRouteSettings): void {
  app.use('/api', invitationRoutes(settings));
  app.use('/api', passwordResetRoutes(settings));
  app.use('/api/admin', adminInvitationRoutes(settings));
  app.use('/api/admin', adminOutboxRoutes(settings));
}
