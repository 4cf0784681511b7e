import { describeIssues, harvestOptionSchema, type HarvestOption } from '@seinework/contracts';
import { WebError } from '@seinework/network-analysis';

/** OPTION.json (METHODS.md §11) checked for shape: the response defaults to bottom-up; throws WebError. */
export function parseHarvestOption(input: unknown): HarvestOption {
  const parsed = harvestOptionSchema.safeParse(input);
  if (!parsed.success) throw new WebError('invalid', describeIssues(parsed.error).map((p) => `option: ${p}`));
  return parsed.data;
}
