import { eq, sql } from 'drizzle-orm';
import type { Analysis, TableSelection } from '@seinework/contracts';
import type { DifferenceMap } from '@seinework/harvest-options';
import type { Db } from '../db/database';
import { runs } from '../db/schema';
import { proportionateAnalysis, proportionateDifference } from '../engine/analysis-tables';

/**
 * A finished run's result document as JSON text, whole (`?tables=all`) or without the n² tables
 * (the default, as the analysis routes answer). A done run's result never changes, so the text is
 * kept for the most recently read runs: reading a stored run again costs one small query (who may
 * see it) and no parsing or serialising of its document.
 */

const KEPT = 64;

interface Texts {
  all: string;
  summary?: string;
}

const kept = new Map<string, Texts>();

export async function resultText(db: Db, runId: string, tables: TableSelection): Promise<string> {
  let texts = kept.get(runId);
  if (texts) {
    // most recently read last
    kept.delete(runId);
    kept.set(runId, texts);
  } else {
    const [row] = await db
      .select({ text: sql<string>`${runs.result}::text` })
      .from(runs)
      .where(eq(runs.id, runId));
    texts = { all: row?.text ?? 'null' };
    kept.set(runId, texts);
    if (kept.size > KEPT) kept.delete(kept.keys().next().value!);
  }
  if (tables === 'all') return texts.all;
  texts.summary ??= JSON.stringify(summaryOf(JSON.parse(texts.all) as Record<string, unknown> | null));
  return texts.summary;
}

function summaryOf(document: Record<string, unknown> | null): unknown {
  if (document === null) return null;
  return {
    ...document,
    baseline: proportionateAnalysis(document['baseline'] as Analysis, 'summary'),
    option: proportionateAnalysis(document['option'] as Analysis, 'summary'),
    difference: proportionateDifference(document['difference'] as DifferenceMap, 'summary'),
  };
}
