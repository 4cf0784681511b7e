import { z } from 'zod';

/**
 * WEB.json — the project's own file format for a steady-state food web (METHODS.md §11).
 * Shape only: the network-analysis engine checks meaning (ids exist, no duplicates, balance).
 * Unknown keys are refused everywhere so that a typo never silently drops data.
 */

const finiteNonNegative = (what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .refine(Number.isFinite, { message: `${what} must be finite` })
    .refine((v) => v >= 0, { message: `${what} must not be negative` });

const coefficientOfVariation = z
  .number({ error: 'cv must be a number' })
  .refine((v) => Number.isFinite(v) && v >= 0, { message: 'cv must be a finite number ≥ 0' })
  .optional();

const id = z.string({ error: 'id must be a string' }).trim().min(1, 'id must not be empty');

export const compartmentKindSchema = z.enum(['producer', 'consumer', 'detritus'], {
  error: 'kind must be one of producer, consumer, detritus',
});
export type CompartmentKind = z.infer<typeof compartmentKindSchema>;

export const compartmentSchema = z.strictObject({
  id,
  name: z.string({ error: 'name must be a string' }).min(1, 'name must not be empty'),
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
  fleet: z.string().trim().min(1, 'fleet must not be empty').optional(),
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
  name: z.string({ error: 'name must be a string' }).min(1, 'name must not be empty'),
  unit: z.string({ error: 'unit must be a string' }).min(1, 'unit must not be empty'),
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
