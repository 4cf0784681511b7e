import { z } from 'zod';

/**
 * OPTION.json — a harvest option: adjustments on a published baseline plus a response rule
 * (METHODS.md §8 and §11). Shape only; the harvest-option engine checks the adjustments
 * against the web (fleet and compartment exist, targets can be supplied, no contradictions).
 */

const name = (what: string) => z.string({ error: `${what} must be a string` }).trim().min(1, `${what} must not be empty`);

const percent = z
  .number({ error: 'percent must be a number' })
  .refine(Number.isFinite, { message: 'percent must be finite' })
  .refine((v) => v >= -100, { message: 'percent must not be below -100 (a catch cannot fall below zero)' });

const amount = z
  .number({ error: 'amount must be a number' })
  .refine((v) => Number.isFinite(v) && v >= 0, { message: 'amount must be a finite number ≥ 0' });

export const responseRuleSchema = z.enum(['bottom-up', 'least-change'], {
  error: 'response must be "bottom-up" or "least-change"',
});
export type ResponseRule = z.infer<typeof responseRuleSchema>;

export const adjustmentSchema = z.discriminatedUnion(
  'type',
  [
    z.strictObject({ type: z.literal('scale-catch'), fleet: name('fleet'), compartment: name('compartment'), percent }),
    z.strictObject({ type: z.literal('set-catch'), fleet: name('fleet'), compartment: name('compartment'), amount }),
    z.strictObject({ type: z.literal('close-fleet'), fleet: name('fleet') }),
    z.strictObject({ type: z.literal('open-fishery'), fleet: name('fleet'), compartment: name('compartment'), amount }),
    z.strictObject({ type: z.literal('scale-production'), compartment: name('compartment'), percent }),
  ],
  { error: 'type must be one of scale-catch, set-catch, close-fleet, open-fishery, scale-production' },
);
export type Adjustment = z.infer<typeof adjustmentSchema>;

export const uncertaintySettingsSchema = z.strictObject({
  draws: z
    .number({ error: 'draws must be a number' })
    .int('draws must be a whole number')
    .min(1, 'draws must be at least 1')
    .max(100_000, 'draws must be at most 100000'),
  /** Default coefficient of variation for flows that carry none of their own. */
  cv: z
    .number({ error: 'cv must be a number' })
    .refine((v) => Number.isFinite(v) && v >= 0 && v <= 2, { message: 'cv must be between 0 and 2' }),
  seed: z.number({ error: 'seed must be a number' }).int('seed must be a whole number'),
});
export type UncertaintySettings = z.infer<typeof uncertaintySettingsSchema>;

export const harvestOptionSchema = z.strictObject({
  name: name('name'),
  response: responseRuleSchema.default('bottom-up'),
  adjustments: z.array(adjustmentSchema),
  uncertainty: uncertaintySettingsSchema.optional(),
});
export type HarvestOption = z.infer<typeof harvestOptionSchema>;
export type HarvestOptionInput = z.input<typeof harvestOptionSchema>;
