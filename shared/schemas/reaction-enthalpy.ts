import { z } from 'zod';
import { fractionTextSchema } from './balance';
import { revisionNumberSchema, sourceRefSchema, transitionSchema } from './library';
import { libraryPhaseSchema, provenanceSchema } from './library-core';

/**
 * POST /api/v1/reaction-enthalpy and /reaction-heat: public and stable. Energies are JSON numbers
 * in kJ/mol (per mole of reaction as written in the returned equation), unrounded; uncertainties
 * are standard uncertainties (k = 1), null when not stated. ΔH < 0: heat released.
 */

const finiteNumber = z.number().refine(Number.isFinite, 'Must be a finite number.');

export const temperatureInputSchema = z.object({
  value: finiteNumber,
  unit: z.enum(['K', 'C', 'F']).default('K'),
});
export type TemperatureInput = z.infer<typeof temperatureInputSchema>;

export const reactionEnthalpyInputSchema = z.object({
  equation: z.string().min(1, 'Type an equation.').max(10_000),
  temperature: temperatureInputSchema.optional(),
  revision: revisionNumberSchema.optional(),
  /** Use Cp(298.15 K) of each species as constant instead of its model (flagged in the reply). */
  constantCpEstimate: z.boolean().optional(),
  /** A team whose derived values stand in for species the library lacks (the caller must belong to it). */
  teamId: z.uuid().optional(),
  /** Also ΔrH° at evenly spaced temperatures from `from` to `to` (K), for a plot; at most 200 points. */
  curve: z
    .object({
      from: finiteNumber.positive('Temperatures are above 0 K.'),
      to: finiteNumber.positive('Temperatures are above 0 K.'),
      points: z.number().int().min(2).max(200).default(50),
    })
    .refine((c) => c.to > c.from, { message: 'The curve must run from a lower to a higher temperature.', path: ['to'] })
    .optional(),
});
export type ReactionEnthalpyInput = z.infer<typeof reactionEnthalpyInputSchema>;

export const energySchema = z.object({
  value: z.number(),
  uncertainty: z.number().nullable(),
  unit: z.literal('kJ/mol'),
});

export const warningSchema = z.object({
  code: z.string(),
  message: z.string(),
  term: z.number().int().optional(),
});

const heatingValueSchema = z.object({
  label: z.string(),
  /** kJ per mol of fuel. */
  perMole: z.number(),
  /** kJ per kg of fuel. */
  perKilogram: z.number(),
  uncertaintyPerMole: z.number().nullable(),
});

export const enthalpyTermSchema = z.object({
  formula: z.string(),
  phase: libraryPhaseSchema,
  descriptor: z.string().nullable(),
  coefficient: fractionTextSchema,
  side: z.enum(['reactant', 'product']),
  speciesId: z.uuid(),
  /** The library species' own key and name. */
  key: z.string(),
  name: z.string(),
  /** ΔfH°(298.15 K) used, or null for a species known only through its model at T. */
  deltaFH: z.object({ value: z.number(), uncertainty: z.number().nullable() }).nullable(),
  source: sourceRefSchema.nullable(),
  /** Provenance of the ΔfH° used (typed from memory is shown as such). */
  provenance: provenanceSchema.nullable(),
  /** g/mol. */
  molarMass: z.number(),
  /** Valid range of the species' heat-capacity model, K, or null without one. */
  modelRange: z.tuple([z.number(), z.number()]).nullable(),
});

export const contributionSchema = z.object({
  speciesId: z.uuid(),
  key: z.string(),
  /** Net signed coefficient (products positive) after merging terms of the same species. */
  coefficient: fractionTextSchema,
  /** ν·ΔfH° (or ν·H(T) for a model-only species), kJ/mol. */
  contribution: z.number(),
  /** |ν|·u, kJ/mol; null when the value states no uncertainty. */
  uncertainty: z.number().nullable(),
  /** Share of the variance of ΔrH°, 0–1; null when its uncertainty is not stated. */
  varianceShare: z.number().nullable(),
});

export const reactionEnthalpyResultSchema = z.object({
  /** The balanced equation the energies refer to. */
  equation: z.string(),
  deltaH: energySchema,
  deltaU: energySchema,
  temperature: z.object({ value: z.number(), unit: z.literal('K') }),
  /** ΔrH°(298.15 K), when every species has a 298.15 K value (same as deltaH at 298.15 K). */
  deltaH298: energySchema.nullable(),
  terms: z.array(enthalpyTermSchema),
  contributions: z.array(contributionSchema),
  /** False when some value has no stated uncertainty: `uncertainty` covers only the stated ones. */
  uncertaintyComplete: z.boolean(),
  uncertaintyMissing: z.array(z.string()),
  /** How the uncertainty was combined, in words (independent inputs, root-sum-square). */
  uncertaintyMethod: z.string(),
  deltaS: z
    .object({ value: z.number(), unit: z.literal('J/(mol K)') })
    .nullable()
    .optional(),
  deltaG: energySchema.nullable().optional(),
  K: z.number().nullable().optional(),
  /** Δn(gas), moles of gas per mole of reaction (products − reactants). */
  deltaNGas: fractionTextSchema,
  /** Phase changes and discontinuous joints crossed between 298.15 K and T, per species. */
  transitions: z.array(transitionSchema.extend({ speciesId: z.uuid(), key: z.string() })),
  /** Whether a constant-Cp estimate was used (only on request). */
  constantCpEstimate: z.boolean(),
  libraryRevision: z.number().int(),
  sources: z.array(sourceRefSchema),
  /**
   * For a combustion (one fuel burnt in O2 with water among the products): higher (water liquid)
   * and lower (water vapour) heating values at 298.15 K, positive for heat given off.
   */
  heatingValues: z
    .object({
      fuel: z.string(),
      higher: heatingValueSchema,
      lower: heatingValueSchema,
    })
    .nullable(),
  /** ΔrH°(T) in kJ/mol at the temperatures asked in `curve`; temperatures outside a species' model are left out. */
  curve: z
    .object({
      points: z.array(z.object({ temperature: z.number(), deltaH: z.number() })),
      /** Temperatures that had no value, with the reason. */
      gaps: z.array(z.object({ temperature: z.number(), reason: z.string() })),
    })
    .nullable(),
  warnings: z.array(warningSchema),
});
export type ReactionEnthalpyResult = z.infer<typeof reactionEnthalpyResultSchema>;

export const massUnitSchema = z.enum(['g', 'kg', 'lb']);
export const pressureInputSchema = z.object({
  value: finiteNumber.positive(),
  unit: z.enum(['Pa', 'kPa', 'bar', 'atm']).default('bar'),
});

export const amountInputSchema = z.object({
  /** Term index, from 0 in input order. */
  term: z.number().int().min(0),
  value: finiteNumber.positive('An amount must be greater than zero.'),
  unit: z.enum(['g', 'kg', 'lb', 'mol', 'L']),
  /** Required with L: the gas's temperature and pressure (ideal gas). */
  temperature: temperatureInputSchema.optional(),
  pressure: pressureInputSchema.optional(),
});

export const reactionHeatInputSchema = reactionEnthalpyInputSchema
  .extend({
    amounts: z.array(amountInputSchema).min(1, 'Give the amount of at least one species.').max(40),
    batch: z
      .object({
        mass: z.object({ value: finiteNumber.positive(), unit: massUnitSchema }),
        cp: z.object({ value: finiteNumber.positive(), unit: z.literal('J/(g K)') }),
      })
      .optional(),
  })
  .superRefine((input, ctx) => {
    input.amounts.forEach((a, i) => {
      if (a.unit === 'L' && (!a.temperature || !a.pressure))
        ctx.addIssue({
          code: 'custom',
          path: ['amounts', i],
          message: 'A gas volume needs its temperature and pressure.',
        });
    });
  });
export type ReactionHeatInput = z.infer<typeof reactionHeatInputSchema>;

export const reactionHeatResultSchema = z.object({
  equation: z.string(),
  deltaH: energySchema,
  temperature: z.object({ value: z.number(), unit: z.literal('K') }),
  /** Extent of reaction, mol. */
  extent: z.object({ value: z.number(), unit: z.literal('mol') }),
  /** The term that runs out first. */
  limitingTerm: z.number().int(),
  /** What is left of the other reactants given. */
  excess: z.array(
    z.object({
      term: z.number().int(),
      key: z.string(),
      left: z.object({ value: z.number(), unit: z.literal('mol') }),
      leftMass: z.object({ value: z.number(), unit: z.literal('g') }),
    }),
  ),
  /** ξ·ΔrH, kJ: negative when released. */
  heat: z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('kJ') }),
  direction: z.enum(['released', 'absorbed', 'none']),
  /** Screening estimate of the adiabatic temperature rise, K (only with a batch). */
  adiabaticRise: z.object({ value: z.number(), unit: z.literal('K') }).nullable(),
  cautions: z.array(z.string()),
  uncertaintyComplete: z.boolean(),
  uncertaintyMissing: z.array(z.string()),
  libraryRevision: z.number().int(),
  warnings: z.array(warningSchema),
});
export type ReactionHeatResult = z.infer<typeof reactionHeatResultSchema>;
