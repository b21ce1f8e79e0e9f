import { z } from 'zod';
import { fractionTextSchema } from './balance';
import { revisionNumberSchema } from './library';
import { temperatureInputSchema, warningSchema } from './reaction-enthalpy';

/**
 * POST /api/v1/derive: ΔH of a target reaction by Hess's law from known reactions. Public and
 * stable. Energies in kJ/mol at 298.15 K per mole of reaction as written; uncertainties are
 * standard uncertainties (k = 1), null when not stated.
 */

const finiteNumber = z.number().refine(Number.isFinite, 'Must be a finite number.');

export const givenReactionSchema = z.object({
  equation: z.string().min(1, 'Type the reaction.').max(2_000),
  deltaH: z.object({
    value: finiteNumber,
    uncertainty: finiteNumber.nonnegative('An uncertainty is not negative.').optional(),
    unit: z.enum(['kJ/mol', 'kcal/mol', 'J/mol']).default('kJ/mol'),
  }),
  /** The temperature the ΔH refers to, when not 298.15 K. */
  temperature: temperatureInputSchema.optional(),
});
export type GivenReaction = z.infer<typeof givenReactionSchema>;

export const deriveInputSchema = z.object({
  target: z.string().min(1, 'Type the target reaction.').max(2_000),
  using: z.enum(['library', 'given', 'both']).optional(),
  reactions: z.array(givenReactionSchema).max(100, 'At most 100 given reactions.').optional(),
  /** Routes to list, best first (1–20; default 5). */
  maxRoutes: z.number().int().min(1).max(20).optional(),
  revision: revisionNumberSchema.optional(),
  /** A team whose derived values join the library's (the caller must belong to it). */
  teamId: z.uuid().optional(),
});
export type DeriveInput = z.infer<typeof deriveInputSchema>;

const energy = z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('kJ/mol') });

export const routeStepSchema = z.object({
  equation: z.string(),
  multiplier: fractionTextSchema,
  /** multiplier × ΔH of the reaction, with multiplier × its u. */
  deltaH: energy,
  ref: z.object({
    kind: z.enum(['formation', 'measured', 'given', 'derived']),
    /** Library species id (formation), reaction id (measured), derived value id. */
    id: z.string().optional(),
    /** Index in `reactions` (given). */
    index: z.number().int().optional(),
  }),
  /** ΔH of the reaction as written (before the multiplier). */
  reactionDeltaH: energy,
  source: z.string().nullable(),
  /** The species this step is about (formation steps). */
  species: z.string().nullable(),
});

export const routeSchema = z.object({
  steps: z.array(routeStepSchema),
  deltaH: energy,
  agrees: z.boolean(),
  uncertaintyComplete: z.boolean(),
  /** Inputs without a stated uncertainty. */
  missing: z.array(z.string()),
  /** (route − combined value) / its standard deviation, when compared. */
  normalizedResidual: z.number().nullable(),
});
export type DeriveRoute = z.infer<typeof routeSchema>;

export const deriveResultSchema = z.object({
  status: z.enum(['derived', 'unreachable']),
  /** The target as balanced. */
  target: z.string(),
  deltaH: energy.nullable(),
  /** combined: GLS of agreeing routes; best-route: the best-ranked route (routes disagree or lack u). */
  basis: z.enum(['combined', 'best-route', 'single-route']).nullable(),
  uncertaintyComplete: z.boolean(),
  uncertaintyMissing: z.array(z.string()),
  routes: z.array(routeSchema),
  consistent: z.boolean(),
  agreement: z
    .object({ chiSquare: z.number(), degreesOfFreedom: z.number().int(), pValue: z.number().nullable() })
    .nullable(),
  unreachable: z.array(z.string()).optional(),
  suggestion: z.string().optional(),
  search: z.object({
    examined: z.number().int(),
    found: z.number().int(),
    stoppedBy: z.enum(['examined', 'time', 'routes']).nullable(),
  }),
  libraryRevision: z.number().int(),
  warnings: z.array(warningSchema),
});
export type DeriveResult = z.infer<typeof deriveResultSchema>;

/** POST /api/v1/library/consistency (curators): fit a group of species to the measurements that link them. */
export const consistencyInputSchema = z.object({
  /** Species keys as the library writes them, e.g. ["CO(g)", "CO2(g)"]. */
  species: z.array(z.string().min(1).max(200)).min(1, 'Pick at least one species.').max(200),
  revision: revisionNumberSchema.optional(),
});
export type ConsistencyInput = z.infer<typeof consistencyInputSchema>;

export const consistencyResultSchema = z.object({
  fitted: z.array(
    z.object({
      species: z.string(),
      value: z.number(),
      uncertainty: z.number(),
      /** The library's selected value now, for comparison. */
      library: z.object({ value: z.number(), uncertainty: z.number().nullable() }).nullable(),
    }),
  ),
  residuals: z.array(
    z.object({
      reaction: z.string(),
      equation: z.string(),
      residual: z.number(),
      uncertainty: z.number(),
      normalized: z.number(),
      flagged: z.boolean(),
    }),
  ),
  chiSquare: z.number(),
  degreesOfFreedom: z.number().int(),
  birgeRatio: z.number().nullable(),
  /** Measurements left out, with the reason. */
  excluded: z.array(z.object({ reaction: z.string(), reason: z.string() })),
  heldWithoutUncertainty: z.array(z.string()),
  libraryRevision: z.number().int(),
});
export type ConsistencyResult = z.infer<typeof consistencyResultSchema>;
