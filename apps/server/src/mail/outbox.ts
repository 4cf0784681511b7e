import { count, desc } from 'drizzle-orm';
import type { OutboxMessage, Page } from '@seinework/contracts';
import type { Db } from '../db/database';
import { emailOutbox } from '../db/schema';
import type { ParsedMessage } from './parse-message';

/** The database outbox: what the local fake SMTP server received, newest first for the admin page. */

export function outboxStore(db: Db): (message: ParsedMessage) => Promise<void> {
  return async (message) => {
    await db.insert(emailOutbox).values({ to: message.to, subject: message.subject, text: message.text });
  };
}

export async function listOutbox(db: Db, page: number, pageSize: number): Promise<Page<OutboxMessage>> {
  const [rows, [{ total }]] = await Promise.all([
    // the id breaks ties between messages of the same instant, so the order is the order received
    db.select().from(emailOutbox).orderBy(desc(emailOutbox.id)).limit(pageSize).offset((page - 1) * pageSize),
    db.select({ total: count() }).from(emailOutbox),
  ]);
  return { items: rows.map((row) => ({ to: row.to, subject: row.subject, text: row.text, sentAt: row.sentAt.toISOString() })), total };
}
