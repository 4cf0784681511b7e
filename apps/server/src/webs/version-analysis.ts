import { and, eq } from 'drizzle-orm';
import type { TableSelection, Web } from '@seinework/contracts';
import type { Db } from '../db/database';
import { versionAnalyses } from '../db/schema';
import type { EngineJobs } from '../engine/engine-jobs';

/**
 * The analysis of a stored version, computed by the engine (on a worker) once per table selection
 * and kept: a version's web never changes, so neither does its analysis. An unbalanced draft is
 * refused by the engine (422).
 */
export async function versionAnalysis(db: Db, engine: EngineJobs, versionId: string, tables: TableSelection, web: () => Promise<Web>, signal: AbortSignal): Promise<unknown> {
  const [cached] = await db
    .select({ document: versionAnalyses.document })
    .from(versionAnalyses)
    .where(and(eq(versionAnalyses.versionId, versionId), eq(versionAnalyses.tables, tables)));
  if (cached) return cached.document;
  const document: unknown = JSON.parse((await engine.analyzeOffThread(await web(), { tables, signal })).toString('utf8'));
  // Two first readers may both compute it; the first stored answer stands.
  await db.insert(versionAnalyses).values({ versionId, tables, document }).onConflictDoNothing();
  return document;
}
