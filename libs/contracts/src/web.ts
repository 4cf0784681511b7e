import { z } from 'zod';
import { finiteNonNegative, finiteNumber } from './numbers';
import { TEXT_LIMITS, textField } from './text';

export { TEXT_LIMITS } from './text';

/**
 * WEB.json — the project's own file format for a steady-state food web (METHODS.md §11).
 * Shape only: the network-analysis engine checks meaning (ids exist, no duplicates, balance).
 * Unknown keys are refused everywhere so that a typo never silently drops data.
 */

/**
 * A flow's own coefficient of variation. 0 holds the flow exactly in least change and in the
 * uncertainty draws. Above 0 it is a weight of least change ((cv × value)² is the flow's variance)
 * and the spread of its lognormal draws: below 1e-6 the variance of a small flow vanishes in
 * double precision and the flow would be held anyway, and above 10 the weights of one web would
 * span more than its normal equations can resolve (the option's default cv, applied to every flow
 * at once, stops at 2; one flow may be marked much less certain than the rest).
 */
export const FLOW_CV_LIMITS = { min: 1e-6, max: 10 } as const;

const coefficientOfVariation = finiteNumber('cv')
  .superRefine((cv, ctx) => {
    if (cv < 0) ctx.addIssue({ code: 'custom', message: 'cv must not be negative' });
    else if (cv > FLOW_CV_LIMITS.max) ctx.addIssue({ code: 'custom', message: `cv must be at most ${FLOW_CV_LIMITS.max}` });
    else if (cv > 0 && cv < FLOW_CV_LIMITS.min) ctx.addIssue({ code: 'custom', message: 'cv must be 0 (the flow held exactly) or at least 0.000001' });
  })
  .optional();

const id = textField('id', { max: TEXT_LIMITS.id, trim: true });
const name = textField('name', { max: TEXT_LIMITS.name });

export const compartmentKindSchema = z.enum(['producer', 'consumer', 'detritus'], {
  error: 'kind must be one of producer, consumer, detritus',
});
export type CompartmentKind = z.infer<typeof compartmentKindSchema>;

export const compartmentSchema = z.strictObject({
  id,
  name,
  kind: compartmentKindSchema,
  biomass: finiteNonNegative('biomass').optional(),
});

export const flowSchema = z.strictObject({
  from: id,
  to: id,
  value: finiteNonNegative('flow value'),
  cv: coefficientOfVariation,
});

export const importSchema = z.strictObject({
  to: id,
  value: finiteNonNegative('import value'),
  cv: coefficientOfVariation,
});

export const exportSchema = z.strictObject({
  from: id,
  value: finiteNonNegative('export value'),
  /** A harvest is an export tagged with the fleet that lands it. */
  fleet: textField('fleet', { max: TEXT_LIMITS.id, trim: true }).optional(),
  /** Currency per tonne landed. */
  price: finiteNonNegative('price').optional(),
  cv: coefficientOfVariation,
});

export const respirationSchema = z.strictObject({
  from: id,
  value: finiteNonNegative('respiration value'),
  cv: coefficientOfVariation,
});

export const webSchema = z.strictObject({
  name,
  unit: textField('unit', { max: TEXT_LIMITS.name }),
  areaKm2: finiteNonNegative('areaKm2').optional(),
  /** Tonnes wet weight per km² per year carried by one flow unit. */
  tonnesPerUnit: finiteNonNegative('tonnesPerUnit').optional(),
  compartments: z.array(compartmentSchema).min(1, 'a web needs at least one compartment'),
  flows: z.array(flowSchema),
  imports: z.array(importSchema),
  exports: z.array(exportSchema),
  respiration: z.array(respirationSchema),
});

export type Compartment = z.infer<typeof compartmentSchema>;
export type Flow = z.infer<typeof flowSchema>;
export type Import = z.infer<typeof importSchema>;
export type Export = z.infer<typeof exportSchema>;
export type Respiration = z.infer<typeof respirationSchema>;
export type Web = z.infer<typeof webSchema>;
