import type { Db } from '../db/database';
import { auditEvents } from '../db/schema';

export interface AuditEntry {
  /** The person who did it; null when nobody was signed in (a failed sign-in, the demo seed). */
  readonly actorId: string | null;
  /** A dotted verb, e.g. `user.role-changed`, `web.published`, `auth.sign-in-failed`. */
  readonly action: string;
  /** What it was done to, e.g. `user:<id>`, `web:<id>/version:<id>`. */
  readonly subject: string;
  /** A short readable line for the audit page. */
  readonly detail?: string;
}

/**
 * Writes one audit event. Pass the transaction of the change itself, so that the change and its
 * audit event are stored together or not at all.
 */
export async function recordAudit(dbOrTx: Db, entry: AuditEntry): Promise<void> {
  await dbOrTx.insert(auditEvents).values({ actorId: entry.actorId, action: entry.action, subject: entry.subject, detail: entry.detail ?? '' });
}
