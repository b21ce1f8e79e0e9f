import { z } from 'zod';
import { revisionNumberSchema, sourceRefSchema } from './library';
import { provenanceSchema } from './library-core';
import { warningSchema } from './reaction-enthalpy';

/**
 * POST /api/v1/calorimetry/constant-pressure and /calorimetry/bomb: public, stateless reductions
 * of calorimeter readings. Every quantity is `{value, unit, uncertainty?}` with the uncertainty a
 * standard uncertainty (k = 1) in the same unit. Replies: q in kJ (> 0 when the calorimeter
 * warms), ΔH per mole of reaction as written in kJ/mol (< 0 for a rise), massic energies in J/g,
 * molar energies of combustion and formation in kJ/mol of sample.
 */

const finite = z.number().refine(Number.isFinite, 'Must be a finite number.');
/** Run a cross-field check even when a field inside already failed, so every bad field is named at once. */
const always = { when: () => true };
const uncertainty = finite.nonnegative('An uncertainty is 0 or more.').nullable().optional();

/** A stated quantity in one of `units`. */
export function statedSchema<const U extends readonly [string, ...string[]]>(units: U) {
  return z.object({ value: finite, unit: z.enum(units), uncertainty });
}

/** At most this many readings in one time–temperature series (one reading a second for 2.5 h). */
export const MAX_SERIES_POINTS = 10_000;
/** At most this many runs (sample or calibration) in one bomb request. */
export const MAX_BOMB_RUNS = 30;
/** At most this many calibration runs of a constant-pressure calorimeter. */
export const MAX_CALIBRATION_RUNS = 30;

export const temperatureUnitSchema = z.enum(['K', 'C', 'F']);
export const driftMethodSchema = z.enum(['dickinson', 'regnault-pfaundler']);

/** A time–temperature series: times in s, temperatures on `unit`, with the period boundaries. */
export const seriesSchema = z
  .array(z.tuple([finite, finite]), 'A series is a list of [time in s, temperature] pairs.')
  .min(4, 'Give at least 4 readings (two before the mixing time and two after the rise).')
  .max(MAX_SERIES_POINTS, `At most ${MAX_SERIES_POINTS} readings.`);

const seriesFields = {
  series: seriesSchema.optional(),
  unit: temperatureUnitSchema.optional(),
  /** s: when the reaction was started (end of the fore-period). */
  mixingTime: finite.optional(),
  method: driftMethodSchema.optional(),
  /** s: start of the after-period; found from the readings when omitted. */
  afterPeriodStart: finite.nullable().optional(),
  /** Standard uncertainty of one reading, in degrees of `unit`. */
  readingUncertainty: finite.nonnegative().nullable().optional(),
};

function requireSeriesFields(
  t: { series?: unknown; unit?: unknown; mixingTime?: unknown; method?: unknown },
  ctx: z.RefinementCtx,
): void {
  for (const key of ['unit', 'mixingTime', 'method'] as const)
    if (t[key] === undefined)
      ctx.addIssue({ code: 'custom', path: [key], message: `is required with a series (${key}).` });
}

/** Temperatures of a constant-pressure run: initial and final readings, or a series. */
export const constantPressureTemperatureSchema = z
  .object({
    initial: statedSchema(['K', 'C', 'F']).optional(),
    final: statedSchema(['K', 'C', 'F']).optional(),
    ...seriesFields,
  })
  .superRefine((t, ctx) => {
    if (typeof t !== 'object' || t === null) return;
    if (t.series) {
      if (t.initial || t.final)
        ctx.addIssue({
          code: 'custom',
          path: ['series'],
          message: 'Give either a series or initial and final readings.',
        });
      requireSeriesFields(t, ctx);
      return;
    }
    if (!t.initial) ctx.addIssue({ code: 'custom', path: ['initial'], message: 'is required (or give a series).' });
    if (!t.final) ctx.addIssue({ code: 'custom', path: ['final'], message: 'is required (or give a series).' });
  }, always);

const electricalCalibrationSchema = z.object({
  kind: z.literal('electrical'),
  current: statedSchema(['A']),
  voltage: statedSchema(['V']),
  duration: statedSchema(['s']),
  deltaT: statedSchema(['K']),
  contents: z.object({ mass: statedSchema(['g', 'kg']), specificHeat: statedSchema(['J/(g K)']) }),
});
const mixingCalibrationSchema = z.object({
  kind: z.literal('mixing'),
  hot: z.object({ mass: statedSchema(['g', 'kg']), temperature: statedSchema(['K', 'C', 'F']) }),
  cold: z.object({ mass: statedSchema(['g', 'kg']), temperature: statedSchema(['K', 'C', 'F']) }),
  finalTemperature: statedSchema(['K', 'C', 'F']),
  specificHeat: statedSchema(['J/(g K)']).optional(),
});
export const calibrationRunSchema = z.discriminatedUnion('kind', [
  electricalCalibrationSchema,
  mixingCalibrationSchema,
]);
export type CalibrationRunInput = z.infer<typeof calibrationRunSchema>;

const replicateOptionsSchema = z.object({
  confidence: finite.min(0.5).max(0.999).optional(),
  outlierSignificance: finite.min(0.001).max(0.2).optional(),
});

/** A concentration recorded with a run (finite concentration: the result is not ΔrH° at infinite dilution). */
export const concentrationSchema = z.object({
  species: z.string().min(1).max(100),
  value: finite.positive(),
  unit: z.enum(['mol/L', 'mol/kg']),
});

export const constantPressureInputSchema = z.object({
  solution: z
    .object({
      mass: statedSchema(['g', 'kg']).optional(),
      volume: statedSchema(['mL', 'L']).optional(),
      density: statedSchema(['g/mL']).optional(),
    })
    .superRefine((s, ctx) => {
      if (typeof s !== 'object' || s === null) return;
      if (s.mass) {
        if (s.volume || s.density)
          ctx.addIssue({ code: 'custom', path: ['mass'], message: 'Give either a mass or a volume with its density.' });
        return;
      }
      if (!s.volume) ctx.addIssue({ code: 'custom', path: ['volume'], message: 'is required (or give a mass).' });
      if (!s.density) ctx.addIssue({ code: 'custom', path: ['density'], message: 'is required with a volume.' });
    }, always),
  /** Default: water's 4.184 J/(g K). */
  specificHeat: statedSchema(['J/(g K)']).optional(),
  /** The calorimeter itself; default 0 J/K (stated in a warning) unless calibration runs are given. */
  calorimeterHeatCapacity: statedSchema(['J/K']).optional(),
  calibration: z.object({ runs: z.array(calibrationRunSchema).min(1).max(MAX_CALIBRATION_RUNS) }).optional(),
  temperature: constantPressureTemperatureSchema,
  reaction: z.object({
    equation: z.string().min(1, 'Type an equation.').max(2_000),
    limiting: z.object({
      /** Index of the limiting reactant among the equation's terms, from 0 in the order written. */
      term: z.number().int().nonnegative(),
      amount: statedSchema(['mol', 'mmol', 'g']),
    }),
  }),
  concentrations: z.array(concentrationSchema).max(20).optional(),
  replicates: replicateOptionsSchema.optional(),
});
export type ConstantPressureInput = z.infer<typeof constantPressureInputSchema>;

const energy = <const U extends string>(unit: U) =>
  z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal(unit) });

export const contributionSchema = z.object({
  id: z.string(),
  label: z.string(),
  value: z.number(),
  unit: z.string(),
  uncertainty: z.number().nullable(),
  sensitivity: z.number(),
  /** |∂y/∂x|·u(x) in the result's unit; null when u(x) was not stated. */
  contribution: z.number().nullable(),
  varianceShare: z.number().nullable(),
});
export type Contribution = z.infer<typeof contributionSchema>;

const driftLineSchema = z.object({
  slope: z.number(),
  anchor: z.object({ time: z.number(), temperature: z.number() }),
  from: z.number(),
  to: z.number(),
  points: z.number().int(),
  residualSd: z.number().nullable(),
});

/** How the corrected ΔT was found from a series; temperatures in K, times in s. */
export const driftReplySchema = z.object({
  method: driftMethodSchema,
  fore: driftLineSchema,
  after: driftLineSchema,
  mainPeriod: z.object({ start: z.number(), end: z.number() }),
  afterPeriodFound: z.boolean(),
  observedDeltaT: z.number(),
  correctedDeltaT: z.number(),
  tMid: z.number().nullable(),
  riseFractionAtTMid: z.number().nullable(),
  notes: z.array(z.string()),
});
export type DriftReply = z.infer<typeof driftReplySchema>;

export const deltaTReplySchema = z.object({
  value: z.number(),
  uncertainty: z.number().nullable(),
  unit: z.literal('K'),
  source: z.enum(['readings', 'series']),
  drift: driftReplySchema.nullable(),
});

const outlierSchema = z.object({
  applicable: z.boolean(),
  statistic: z.number().nullable(),
  critical: z.number().nullable(),
  candidate: z.number().int().nullable(),
  flagged: z.boolean(),
  rule: z.string(),
});
export const replicateReplySchema = z.object({
  n: z.number().int(),
  mean: z.number(),
  standardDeviation: z.number().nullable(),
  standardUncertainty: z.number().nullable(),
  degreesOfFreedom: z.number().int(),
  confidence: z.number(),
  coverageFactor: z.number().nullable(),
  expandedUncertainty: z.number().nullable(),
  outlier: outlierSchema,
});

export const constantPressureResultSchema = z.object({
  equation: z.string(),
  limiting: z.object({
    term: z.number().int(),
    species: z.string(),
    coefficient: z.string(),
    amount: z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('mol') }),
  }),
  extent: z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('mol') }),
  solutionMass: z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('g') }),
  heatCapacity: z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('J/K') }),
  calibration: z
    .object({
      value: z.number(),
      uncertainty: z.number().nullable(),
      basis: z.enum(['one-run', 'replicates']),
      runs: z.array(z.number()),
      replicates: replicateReplySchema.nullable(),
    })
    .nullable(),
  deltaT: deltaTReplySchema,
  q: energy('kJ'),
  deltaH: energy('kJ/mol'),
  contributions: z.array(contributionSchema),
  uncertaintyComplete: z.boolean(),
  uncertaintyMethod: z.string(),
  concentrations: z.array(concentrationSchema),
  /** Always states that the result is at the run's concentrations, not at infinite dilution. */
  basis: z.string(),
  warnings: z.array(warningSchema),
  cautions: z.array(z.string()),
});
export type ConstantPressureResult = z.infer<typeof constantPressureResultSchema>;

// ---- Bomb ---------------------------------------------------------------------------------

const energySourceSchema = statedSchema(['J', 'kJ', 'cal']);

export const bombRunSchema = z.object({
  /** The sample's (or calibrant's) mass; weighed in air when `buoyancy` is given. */
  mass: statedSchema(['g', 'mg']),
  /** Densities in g/cm³ for the buoyancy correction of a weighing in air (air and weights default). */
  buoyancy: z
    .object({
      sampleDensity: finite.positive(),
      airDensity: finite.positive().optional(),
      weightsDensity: finite.positive().optional(),
    })
    .optional(),
  temperature: z.object({ rise: statedSchema(['K', 'C', 'F']).optional(), ...seriesFields }).superRefine((t, ctx) => {
    if (typeof t !== 'object' || t === null) return;
    if (t.series) {
      if (t.rise) ctx.addIssue({ code: 'custom', path: ['rise'], message: 'Give either a series or a rise.' });
      requireSeriesFields(t, ctx);
    } else if (!t.rise) ctx.addIssue({ code: 'custom', path: ['rise'], message: 'is required (or give a series).' });
  }, always),
  /** Energy of the fuse: as energy, or the length burnt with the wire's energy per length. */
  fuse: z
    .object({
      energy: energySourceSchema.optional(),
      length: statedSchema(['cm']).optional(),
      energyPerLength: statedSchema(['J/cm']).optional(),
    })
    .superRefine((f, ctx) => {
      if (typeof f !== 'object' || f === null) return;
      if (f.energy) return;
      if (!f.length) ctx.addIssue({ code: 'custom', path: ['length'], message: 'is required (or give an energy).' });
      if (!f.energyPerLength)
        ctx.addIssue({ code: 'custom', path: ['energyPerLength'], message: 'is required with a length.' });
    }, always)
    .optional(),
  /** Nitric acid formed: as energy, or the titration of the washings (molar energy default 59.7 kJ/mol). */
  nitricAcid: z
    .object({
      energy: energySourceSchema.optional(),
      titrantVolume: statedSchema(['mL']).optional(),
      titrantConcentration: statedSchema(['mol/L']).optional(),
      molarEnergy: statedSchema(['kJ/mol']).optional(),
    })
    .superRefine((n, ctx) => {
      if (typeof n !== 'object' || n === null) return;
      if (n.energy) return;
      if (!n.titrantVolume)
        ctx.addIssue({ code: 'custom', path: ['titrantVolume'], message: 'is required (or give an energy).' });
      if (!n.titrantConcentration)
        ctx.addIssue({ code: 'custom', path: ['titrantConcentration'], message: 'is required with a titrant volume.' });
    }, always)
    .optional(),
  auxiliary: energySourceSchema.optional(),
  ignition: energySourceSchema.optional(),
});
export type BombRunInput = z.infer<typeof bombRunSchema>;

export const bombInputSchema = z
  .object({
    sample: z.object({
      formula: z.string().min(1, 'Type the formula of the sample.').max(200),
      phase: z.enum(['cr', 'l', 'g']),
      /** Where sulfur ends; default H2SO4(aq) (rotating bomb with water). */
      sulfurProduct: z.enum(['H2SO4(aq)', 'SO2(g)']).optional(),
    }),
    /** A typed energy equivalent… */
    energyEquivalent: statedSchema(['J/K', 'kJ/K']).optional(),
    /** …or calibration runs with the calibrant's certificate. */
    calibration: z
      .object({
        certificate: z.object({
          /** The certified massic energy of combustion under the certificate's bomb conditions (< 0). */
          massicEnergy: statedSchema(['J/g', 'kJ/g']),
          citation: z.string().min(1, 'Cite the certificate.').max(500),
        }),
        runs: z.array(bombRunSchema).min(1).max(MAX_BOMB_RUNS),
      })
      .optional(),
    runs: z.array(bombRunSchema).min(1, 'Give at least one sample run.').max(MAX_BOMB_RUNS),
    /** Standard-state (Washburn) corrections, J/g added to the bomb massic energy; not applied when omitted. */
    standardStateCorrection: statedSchema(['J/g']).optional(),
    /** For Δn(gas)·R·T; default 298.15 K. */
    temperature: statedSchema(['K', 'C', 'F']).optional(),
    /** Library revision for ΔfH° of the products; default the newest. */
    revision: revisionNumberSchema.optional(),
    replicates: replicateOptionsSchema.optional(),
  })
  .superRefine((b, ctx) => {
    if (typeof b !== 'object' || b === null) return;
    if (b.energyEquivalent && b.calibration)
      ctx.addIssue({
        code: 'custom',
        path: ['energyEquivalent'],
        message: 'Give either an energy equivalent or calibration runs.',
      });
    if (!b.energyEquivalent && !b.calibration)
      ctx.addIssue({
        code: 'custom',
        path: ['calibration'],
        message: 'is required (or give energyEquivalent).',
      });
  }, always);
export type BombInput = z.infer<typeof bombInputSchema>;

/** A library value used in the Hess cycle, with where it comes from. */
export const auxiliaryValueSchema = z.object({
  key: z.string(),
  coefficient: z.string(),
  value: z.number(),
  uncertainty: z.number().nullable(),
  source: sourceRefSchema,
  provenance: provenanceSchema,
});
export type AuxiliaryValue = z.infer<typeof auxiliaryValueSchema>;

const bombRunReplySchema = z.object({
  /** J/g for a sample run, J/K for a calibration run. */
  value: z.number(),
  uncertainty: z.number().nullable(),
  mass: z.number(),
  deltaT: deltaTReplySchema,
  /** J: fuse + nitric acid + auxiliary + ignition. */
  corrections: z.object({ fuse: z.number(), nitricAcid: z.number(), auxiliary: z.number(), ignition: z.number() }),
});

export const bombResultSchema = z.object({
  combustion: z.object({ equation: z.string(), deltaNGas: z.string(), molarMass: z.number() }),
  energyEquivalent: z.object({
    value: z.number(),
    uncertainty: z.number().nullable(),
    unit: z.literal('J/K'),
    basis: z.enum(['typed', 'one-run', 'replicates']),
    certificate: z.object({ value: z.number(), uncertainty: z.number().nullable(), citation: z.string() }).nullable(),
    runs: z.array(bombRunReplySchema),
    replicates: replicateReplySchema.nullable(),
  }),
  runs: z.array(bombRunReplySchema),
  replicates: replicateReplySchema,
  massicEnergy: energy('J/g'),
  standardMassicEnergy: energy('J/g').nullable(),
  deltaCU: energy('kJ/mol'),
  deltaCH: energy('kJ/mol'),
  deltaFH: energy('kJ/mol').nullable(),
  standardState: z.object({ applied: z.boolean(), note: z.string() }),
  rt: z.number(),
  auxiliary: z.array(auxiliaryValueSchema),
  libraryRevision: z.number().int().nullable(),
  contributions: z.array(contributionSchema),
  uncertaintyMethod: z.string(),
  warnings: z.array(warningSchema),
  cautions: z.array(z.string()),
});
export type BombResult = z.infer<typeof bombResultSchema>;
