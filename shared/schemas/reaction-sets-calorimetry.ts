import { z } from 'zod';
import {
  bombInputSchema,
  bombResultSchema,
  constantPressureInputSchema,
  constantPressureResultSchema,
} from './calorimetry';
import { runEvidenceSchema } from './calorimetry-runs';
import { idSchema } from './common';
import { plainText } from './text';

/**
 * The calorimetry-run item of a reaction set: a run's reduction request (readings included), the
 * readings file it came from, and which saved team run it was taken from, if any. Never a result:
 * the server reduces the inputs again whenever the set is evaluated, at the set's revision (a bomb
 * run's ΔfH° rests on the library's CO2(g) and H2O(l)), so a shared set shows the server's numbers.
 */

/**
 * Largest stored size of one run, in characters of JSON. A run with a long series and its readings
 * file fits; several such runs reach the 1 MB body limit of a whole set first (413).
 */
export const MAX_CALORIMETRY_RUN_CHARS = 400_000;

const itemFields = {
  kind: z.literal('calorimetry-run'),
  id: z
    .string()
    .regex(/^[A-Za-z0-9_-]{1,64}$/, 'An item id is 1–64 letters, digits, - or _.')
    .optional(),
  label: plainText().trim().max(200, 'A label may be up to 200 characters.').optional(),
  note: plainText().max(5_000, 'A note may be up to 5 000 characters.').optional(),
  /** The readings file as uploaded (the run's evidence); none when the temperatures were typed. */
  evidence: runEvidenceSchema.nullable().optional(),
  /** The saved team run (/teams/:teamId/calorimetry/runs/:runId) the item was taken from. */
  fromRun: idSchema.nullable().optional(),
};

const constantPressureRunItemSchema = z.object({
  ...itemFields,
  runKind: z.literal('constant-pressure'),
  inputs: constantPressureInputSchema,
});

const bombRunItemSchema = z.object({
  ...itemFields,
  runKind: z.literal('bomb'),
  /** `revision` inside is ignored: the set's revision is used. */
  inputs: bombInputSchema,
});

export const calorimetryRunItemSchema = z
  .discriminatedUnion('runKind', [constantPressureRunItemSchema, bombRunItemSchema], {
    error: 'Say which kind of run this is: runKind "constant-pressure" or "bomb".',
  })
  .superRefine((run, ctx) => {
    const size = JSON.stringify(run).length;
    if (size > MAX_CALORIMETRY_RUN_CHARS)
      ctx.addIssue({
        code: 'too_big',
        origin: 'string',
        maximum: MAX_CALORIMETRY_RUN_CHARS,
        path: [],
        message: `A calorimetry run may take up to ${MAX_CALORIMETRY_RUN_CHARS.toLocaleString('en')} characters of JSON (this one takes ${size.toLocaleString('en')}).`,
      });
  });
export type CalorimetryRunItem = z.infer<typeof calorimetryRunItemSchema>;

const energy = z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('kJ/mol') });

/**
 * A run's evaluation in a set: the server's reduction at the set's revision. `deltaH` is the
 * headline: ΔH per mole of reaction as written (constant pressure) or ΔcH° of the sample (bomb).
 */
export const calorimetryRunValueSchema = z.discriminatedUnion('runKind', [
  z.object({
    runKind: z.literal('constant-pressure'),
    equation: z.string(),
    deltaH: energy,
    result: constantPressureResultSchema,
    sources: z.array(z.string()),
  }),
  z.object({
    runKind: z.literal('bomb'),
    equation: z.string(),
    deltaH: energy,
    result: bombResultSchema,
    /** Library keys of the sources of the products' ΔfH° used in the Hess cycle. */
    sources: z.array(z.string()),
  }),
]);
export type CalorimetryRunValue = z.infer<typeof calorimetryRunValueSchema>;
