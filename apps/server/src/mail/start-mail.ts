import type { Db } from '../db/database';
import { startFakeSmtp } from './fake-smtp';
import { createMailer, type Mailer } from './mailer';
import { outboxStore } from './outbox';

export interface MailSetup {
  /** Absent when there is nowhere to send (production without SMTP_URL). */
  readonly mailer?: Mailer;
  /** One line for the start-up log: where e-mail goes. */
  readonly where: string;
  close(): Promise<void>;
}

/**
 * The server's mail: SMTP_URL when set; otherwise, in demo mode, the local fake SMTP server, whose
 * messages land in the outbox (admin → Outbox); otherwise nothing, said loudly at start-up.
 */
export async function startMail(settings: { smtpUrl?: string; demoMode: boolean; db: Db; from?: string }): Promise<MailSetup> {
  if (settings.smtpUrl) {
    const mailer = createMailer(settings.smtpUrl, { from: settings.from });
    return { mailer, where: `E-mail goes to the SMTP server at ${mailer.destination}`, close: async () => mailer.close() };
  }
  if (settings.demoMode) {
    const fake = await startFakeSmtp({ store: outboxStore(settings.db) });
    const mailer = createMailer(fake.url, { from: settings.from });
    return {
      mailer,
      where: `E-mail is kept, not delivered: a local SMTP server on ${fake.url} puts every message in the outbox (Admin → Outbox, GET /api/admin/outbox). Set SMTP_URL to send real mail.`,
      async close() {
        mailer.close();
        await fake.close();
      },
    };
  }
  return { where: 'No SMTP_URL is set: invitations and password-reset links cannot be sent', close: async () => undefined };
}
