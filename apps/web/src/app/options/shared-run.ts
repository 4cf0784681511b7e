import type { OptionSummary, ShareAudience } from '@seinework/contracts';

/**
 * The run an option's active share shows: the share of `audience` when it names one, else any share's;
 * null when it is not shared. Its discussion, its brief and its result links are about that run.
 */
export function sharedRunOf(option: Pick<OptionSummary, 'shares'> | null | undefined, audience?: ShareAudience | null): string | null {
  const shares = option?.shares ?? [];
  const shown = shares.find((s) => s.audience === audience && s.runId) ?? shares.find((s) => s.runId);
  return shown?.runId ?? null;
}
