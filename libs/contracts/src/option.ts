import { z } from 'zod';
import { finiteNonNegative, finiteNumber } from './numbers';
import { TEXT_LIMITS, textField } from './text';

/**
 * OPTION.json — a harvest option: adjustments on a published baseline plus a response rule
 * (METHODS.md §8 and §11). Shape only; the harvest-option engine checks the adjustments
 * against the web (fleet and compartment exist, targets can be supplied, no contradictions).
 */

const name = textField('name', { max: TEXT_LIMITS.name, trim: true });
const fleet = textField('fleet', { max: TEXT_LIMITS.id, trim: true });
const compartment = textField('compartment', { max: TEXT_LIMITS.id, trim: true });

/** A percentage change of `what`, which cannot fall below zero. */
const percent = (what: string) =>
  finiteNumber('percent').refine((v) => v >= -100, { message: `percent must not be below -100 (${what} cannot fall below zero)` });

const amount = finiteNonNegative('amount');

export const responseRuleSchema = z.enum(['bottom-up', 'least-change'], {
  error: 'response must be "bottom-up" or "least-change"',
});
export type ResponseRule = z.infer<typeof responseRuleSchema>;

export const adjustmentSchema = z.discriminatedUnion(
  'type',
  [
    z.strictObject({ type: z.literal('scale-catch'), fleet, compartment, percent: percent('a catch') }),
    z.strictObject({ type: z.literal('set-catch'), fleet, compartment, amount }),
    z.strictObject({ type: z.literal('close-fleet'), fleet }),
    z.strictObject({ type: z.literal('open-fishery'), fleet, compartment, amount }),
    z.strictObject({ type: z.literal('scale-production'), compartment, percent: percent('production') }),
  ],
  { error: 'type must be one of scale-catch, set-catch, close-fleet, open-fishery, scale-production' },
);
export type Adjustment = z.infer<typeof adjustmentSchema>;

export const uncertaintySettingsSchema = z.strictObject({
  draws: finiteNumber('draws')
    .int('draws must be a whole number')
    .min(1, 'draws must be at least 1')
    .max(100_000, 'draws must be at most 100000'),
  /** Default coefficient of variation for flows that carry none of their own. */
  cv: finiteNumber('cv').refine((v) => v >= 0 && v <= 2, { message: 'cv must be between 0 and 2' }),
  seed: finiteNumber('seed').int('seed must be a whole number'),
});
export type UncertaintySettings = z.infer<typeof uncertaintySettingsSchema>;

export const harvestOptionSchema = z.strictObject({
  name,
  response: responseRuleSchema.default('bottom-up'),
  adjustments: z.array(adjustmentSchema),
  uncertainty: uncertaintySettingsSchema.optional(),
});
export type HarvestOption = z.infer<typeof harvestOptionSchema>;
export type HarvestOptionInput = z.input<typeof harvestOptionSchema>;
