import { asc, count, eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';
import { adminPageQuerySchema, userUpdateBodySchema, type Page, type UserSummary } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import { currentUser, requireAction } from '../auth/guards';
import type { Sessions } from '../auth/session';
import type { Db } from '../db/database';
import { users } from '../db/schema';
import { RequestError } from '../http/errors';
import { parseInput } from '../validate';

const userIdSchema = z.strictObject({ id: z.string().min(1).max(100) });

/** `GET /api/admin/users`, `PATCH /api/admin/users/:id` (users.manage). */
export function adminUserRoutes({ db, sessions }: { db: Db; sessions: Sessions }): Router {
  const router = Router();

  router.get('/users', requireAction('users.manage'), async (request, response) => {
    const { page, pageSize } = parseInput(adminPageQuerySchema, request.query, 'query');
    const [rows, [{ total }]] = await Promise.all([
      db.select().from(users).orderBy(asc(users.email)).limit(pageSize).offset((page - 1) * pageSize),
      db.select({ total: count() }).from(users),
    ]);
    response.json({ items: rows.map(summary), total } satisfies Page<UserSummary>);
  });

  router.patch('/users/:id', requireAction('users.manage'), async (request, response) => {
    const { id } = parseInput(userIdSchema, request.params, 'address');
    const body = parseInput(userUpdateBodySchema, request.body);
    if (body.role === undefined && body.active === undefined) throw new RequestError(400, 'Nothing to change: send role, active or both', ['role or active is required']);
    const me = currentUser(response);
    if (id === me.id && ((body.role !== undefined && body.role !== 'admin') || body.active === false)) {
      // the last admin could otherwise lock everyone out of user management
      throw new RequestError(409, 'You cannot remove your own admin role or deactivate yourself: ask another admin');
    }
    const updated = await db.transaction(async (tx) => {
      const [before] = await tx.select().from(users).where(eq(users.id, id)).for('update');
      if (!before) throw new RequestError(404, 'No such user');
      const [after] = await tx.update(users).set({ role: body.role ?? before.role, active: body.active ?? before.active }).where(eq(users.id, id)).returning();
      const changes = [before.role !== after.role ? `role ${before.role} → ${after.role}` : '', before.active !== after.active ? (after.active ? 'reactivated' : 'deactivated') : ''].filter(Boolean);
      await recordAudit(tx, { actorId: me.id, action: 'user.updated', subject: `user:${id}`, detail: `${after.email}: ${changes.join(', ') || 'no change'}` });
      return after;
    });
    // a deactivated person is signed out everywhere at once
    if (!updated.active) await sessions.invalidateUserSessions(updated.id);
    response.json(summary(updated));
  });

  return router;
}

function summary(user: typeof users.$inferSelect): UserSummary {
  return { id: user.id, email: user.email, name: user.name, role: user.role, active: user.active, createdAt: user.createdAt.toISOString() };
}
