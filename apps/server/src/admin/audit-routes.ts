import { count, desc, eq } from 'drizzle-orm';
import { Router } from 'express';
import { adminPageQuerySchema, type AuditEvent, type Page } from '@seinework/contracts';
import { requireAction } from '../auth/guards';
import type { Db } from '../db/database';
import { auditEvents, users } from '../db/schema';
import { parseInput } from '../validate';

/** `GET /api/admin/audit?page&pageSize` (audit.read): newest first; actor by e-mail address. */
export function adminAuditRoutes({ db }: { db: Db }): Router {
  const router = Router();
  router.get('/audit', requireAction('audit.read'), async (request, response) => {
    const { page, pageSize } = parseInput(adminPageQuerySchema, request.query, 'query');
    const [rows, [{ total }]] = await Promise.all([
      db
        .select({ id: auditEvents.id, at: auditEvents.at, actor: users.email, action: auditEvents.action, subject: auditEvents.subject, detail: auditEvents.detail })
        .from(auditEvents)
        .leftJoin(users, eq(users.id, auditEvents.actorId))
        .orderBy(desc(auditEvents.id))
        .limit(pageSize)
        .offset((page - 1) * pageSize),
      db.select({ total: count() }).from(auditEvents),
    ]);
    const items: AuditEvent[] = rows.map((row) => ({ ...row, id: String(row.id), at: row.at.toISOString() }));
    response.json({ items, total } satisfies Page<AuditEvent>);
  });
  return router;
}
