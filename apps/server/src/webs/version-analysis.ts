import { eq } from 'drizzle-orm';
import type { Web } from '@seinework/contracts';
import { analyzeWeb } from '@seinework/network-analysis';
import type { Db } from '../db/database';
import { versionAnalyses } from '../db/schema';
import { HTTP_CYCLE_LIMITS } from '../http/cycle-limits';

/**
 * The analysis of a stored version, computed by the engine once and kept: a version's web never
 * changes, so neither does its analysis. An unbalanced draft is refused by the engine (422).
 */
export async function versionAnalysis(db: Db, versionId: string, web: () => Promise<Web>): Promise<unknown> {
  const [cached] = await db.select({ document: versionAnalyses.document }).from(versionAnalyses).where(eq(versionAnalyses.versionId, versionId));
  if (cached) return cached.document;
  const document = analyzeWeb(await web(), { cycles: HTTP_CYCLE_LIMITS });
  // Two first readers may both compute it; the first stored answer stands.
  await db.insert(versionAnalyses).values({ versionId, document }).onConflictDoNothing();
  return document;
}
