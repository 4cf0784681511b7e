import { Router } from 'express';
import { requireAction } from '../auth/guards';
import type { Db } from '../db/database';
import { listOutbox } from '../mail/outbox';
import { parseInput } from '../validate';
import { pageQuerySchema } from './page-query';

/** `GET /api/admin/outbox?page&pageSize` (outbox.read): what the local fake SMTP server received, newest first. */
export function adminOutboxRoutes({ db }: { db: Db }): Router {
  const router = Router();
  router.get('/outbox', requireAction('outbox.read'), async (request, response) => {
    const { page, pageSize } = parseInput(pageQuerySchema, request.query, 'query');
    response.json(await listOutbox(db, page, pageSize));
  });
  return router;
}
