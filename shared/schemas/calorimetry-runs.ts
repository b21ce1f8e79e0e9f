import { z } from 'zod';
import {
  bombInputSchema,
  bombResultSchema,
  constantPressureInputSchema,
  constantPressureResultSchema,
} from './calorimetry';
import { idSchema, isoDateTimeSchema } from './common';
import { plainText } from './text';

/**
 * A team's saved calorimeter runs (/api/v1/teams/:teamId/calorimetry/runs). The inputs are the
 * reduction request itself, readings included; the server reduces them again on every save, so
 * the stored result is always the server's.
 */

/** The uploaded readings file, kept as it came, as the run's evidence (at most 500 000 characters). */
export const runEvidenceSchema = z.object({
  fileName: plainText().trim().min(1).max(200),
  text: z.string().max(500_000, 'The readings file may hold at most 500 000 characters.'),
});

const runMeta = {
  label: plainText().trim().min(1, 'Give the run a label.').max(200),
  note: plainText().max(5_000).nullable().optional(),
  evidence: runEvidenceSchema.nullable().optional(),
};

export const calorimetryRunInputSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('constant-pressure'), inputs: constantPressureInputSchema, ...runMeta }),
  z.object({ kind: z.literal('bomb'), inputs: bombInputSchema, ...runMeta }),
]);
export type CalorimetryRunInput = z.infer<typeof calorimetryRunInputSchema>;

/** A label or note change leaves the readings and the result as they are. */
export const calorimetryRunPatchSchema = z.object({
  label: runMeta.label.optional(),
  note: runMeta.note,
});
export type CalorimetryRunPatch = z.infer<typeof calorimetryRunPatchSchema>;

const runHeader = {
  id: idSchema,
  teamId: idSchema,
  label: z.string(),
  note: z.string().nullable(),
  authorName: z.string(),
  libraryRevision: z.number().int().nullable(),
  createdAt: isoDateTimeSchema,
  updatedAt: isoDateTimeSchema,
};

export const calorimetryRunSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('constant-pressure'),
    ...runHeader,
    inputs: constantPressureInputSchema,
    result: constantPressureResultSchema,
    evidence: runEvidenceSchema.nullable(),
  }),
  z.object({
    kind: z.literal('bomb'),
    ...runHeader,
    inputs: bombInputSchema,
    result: bombResultSchema,
    evidence: runEvidenceSchema.nullable(),
  }),
]);
export type CalorimetryRun = z.infer<typeof calorimetryRunSchema>;

/** One line of the list: the headline figure without the readings. */
export const calorimetryRunSummarySchema = z.object({
  kind: z.enum(['constant-pressure', 'bomb']),
  ...runHeader,
  /** "HCl(aq) + NaOH(aq) -> …" or the combustion equation of the sample. */
  equation: z.string(),
  /** ΔH per mole of reaction (constant pressure) or ΔcH° of the sample (bomb), kJ/mol. */
  deltaH: z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('kJ/mol') }),
});
export type CalorimetryRunSummary = z.infer<typeof calorimetryRunSummarySchema>;

export const calorimetryRunListSchema = z.object({ runs: z.array(calorimetryRunSummarySchema) });

export const calorimetryRunParamsSchema = z.object({ teamId: idSchema, runId: idSchema });
