import { and, count, desc, eq, isNotNull, isNull, sql } from 'drizzle-orm';
import type { CommentCounts } from '@seinework/contracts';
import type { Db } from '../db/database';
import { comments } from '../db/schema';

/** How the discussion of an option stands, for its brief: counts only, hidden comments left out. */
export async function commentCounts(db: Db, optionId: string): Promise<CommentCounts> {
  const shown = and(eq(comments.optionId, optionId), isNull(comments.hiddenAt));
  const [totals] = await db
    .select({ total: count(), replies: sql<number>`count(${comments.parentId})::int` })
    .from(comments)
    .where(shown);
  const kind = sql<'indicator' | 'compartment'>`${comments.anchor} ->> 'kind'`;
  const key = sql<string>`${comments.anchor} ->> 'key'`;
  const anchors = await db
    .select({ kind, key, count: count() })
    .from(comments)
    .where(and(shown, isNotNull(comments.anchor)))
    .groupBy(kind, key)
    .orderBy(desc(count()), kind, key);
  return {
    total: totals?.total ?? 0,
    replies: totals?.replies ?? 0,
    byAnchor: anchors.filter((a) => a.kind === 'indicator' || a.kind === 'compartment').map((a) => ({ ...a, label: a.key })),
  };
}
