import { z } from 'zod';
import { thermoModelIssues } from '../chemistry/thermo/model-check';
import type { DerivedStandardUncertainty, StatedUncertainty } from '../chemistry/thermo/uncertainty';
import type { HeatCapacityModel, SpeciesThermoModel } from '../chemistry/thermo/types';

/*
 * zod schemas for the heat-capacity models of seeds/library/FORMAT.md (`models-*.jsonl`) and for
 * stated uncertainties. The server and the seed loader validate with these; the cross-field rules
 * (ranges increasing, forms sharing their boundaries, transitions on the relative scale) are the
 * core's own `thermoModelIssues`, so both sides apply the same rules.
 * Units: K; J/(mol K) for Cp°; kJ/mol for enthalpies.
 */

/** A temperature in K: finite, above 0 K. */
export const kelvinSchema = z.number().positive('must be above 0 K');

const coefficientRows = (count: number) =>
  z.array(z.array(z.number()).length(count, `needs exactly ${count} coefficients`)).min(1);

export const nasa7ModelSchema = z.strictObject({
  kind: z.literal('nasa7'),
  ranges: z.array(kelvinSchema).min(2),
  coefficients: coefficientRows(7),
});
export const nasa9ModelSchema = z.strictObject({
  kind: z.literal('nasa9'),
  ranges: z.array(kelvinSchema).min(2),
  coefficients: coefficientRows(9),
});
export const shomateModelSchema = z.strictObject({
  kind: z.literal('shomate'),
  ranges: z.array(kelvinSchema).min(2),
  coefficients: coefficientRows(8),
});
export const cpTableModelSchema = z.strictObject({
  kind: z.literal('cp-table'),
  points: z.array(z.tuple([kelvinSchema, z.number()])).min(2),
});
export const constantCpModelSchema = z.strictObject({
  kind: z.literal('constant'),
  cp: z.number(),
  range: z.tuple([kelvinSchema, kelvinSchema]),
});

/** One heat-capacity model, by `kind`. */
export const heatCapacityModelSchema = z.discriminatedUnion('kind', [
  nasa7ModelSchema,
  nasa9ModelSchema,
  shomateModelSchema,
  cpTableModelSchema,
  constantCpModelSchema,
]);

export const statedTransitionSchema = z.strictObject({ temperature: kelvinSchema, enthalpy: z.number() });

export const thermoFormSchema = z.strictObject({
  form: z.string().min(1).nullable(),
  label: z.string().min(1),
  model: heatCapacityModelSchema,
  transition: statedTransitionSchema.optional(),
});

export const thermoScaleSchema = z.enum(['formation', 'relative']);

const speciesThermoModelShape = {
  species: z.string().min(1),
  scale: thermoScaleSchema,
  forms: z.array(thermoFormSchema).min(1),
};

function crossFieldRules(model: SpeciesThermoModel, ctx: z.RefinementCtx): void {
  for (const issue of thermoModelIssues(model))
    ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
}

/** A species' model as the core evaluates it (species key, scale, forms). */
export const speciesThermoModelSchema = z.strictObject(speciesThermoModelShape).superRefine(crossFieldRules);

/** Where a library value came from (FORMAT.md `provenance`). */
export const provenanceSchema = z.enum(['entered', 'checked', 'memory', 'derived', 'superseded']);

/** One line of `models-*.jsonl`: the model with its source key, the source's own note and its provenance. */
export const thermoModelRecordSchema = z
  .strictObject({
    ...speciesThermoModelShape,
    source: z.string().min(1),
    entryNote: z.string().optional(),
    provenance: provenanceSchema,
  })
  .superRefine(crossFieldRules);

export type HeatCapacityModelInput = z.infer<typeof heatCapacityModelSchema>;
export type SpeciesThermoModelInput = z.infer<typeof speciesThermoModelSchema>;
export type ThermoModelRecord = z.infer<typeof thermoModelRecordSchema>;

/** A stated uncertainty (FORMAT.md `uncertainty_kind`, `uncertainty`, `k`), in the unit of its value. */
export const statedUncertaintySchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('standard'), value: z.number().nonnegative() }),
  z.strictObject({ kind: z.literal('expanded'), value: z.number().nonnegative(), k: z.number().positive() }),
  z.strictObject({ kind: z.literal('two-sigma'), value: z.number().nonnegative() }),
  z.strictObject({ kind: z.literal('interval'), value: z.number().nonnegative() }),
  z.strictObject({ kind: z.literal('none') }),
]);

/** The standard uncertainty derived from a stated one and the rule used, as recorded with a value. */
export const derivedStandardUncertaintySchema = z.strictObject({
  u: z.number().nonnegative().nullable(),
  kind: z.enum(['standard', 'expanded', 'two-sigma', 'interval', 'none']),
  rule: z.string().min(1),
});

// Compile-time checks: what the schemas accept is what the core evaluates.
const _model: (m: HeatCapacityModelInput) => HeatCapacityModel = (m) => m;
const _species: (m: SpeciesThermoModelInput) => SpeciesThermoModel = (m) => m;
const _record: (m: ThermoModelRecord) => SpeciesThermoModel = (m) => m;
const _stated: (s: z.infer<typeof statedUncertaintySchema>) => StatedUncertainty = (s) => s;
const _derived: (d: DerivedStandardUncertainty) => z.infer<typeof derivedStandardUncertaintySchema> = (d) => d;
void [_model, _species, _record, _stated, _derived];
