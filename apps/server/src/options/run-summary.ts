import type { RunSummary } from '@seinework/contracts';
import type { runs } from '../db/schema';

/** A runs row (with its starter's name) as the API shows it. */
export function runSummary(row: Omit<typeof runs.$inferSelect, 'result'>, createdBy: string): RunSummary {
  return {
    id: row.id,
    optionId: row.optionId,
    status: row.status,
    progress: { done: row.progressDone, total: row.progressTotal },
    draws: row.draws,
    cv: row.cv,
    seed: row.seed,
    engineVersion: row.engineVersion,
    createdBy,
    createdAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
    error: row.error,
  };
}
