import { z } from 'zod';
import { plainText } from './text';

/**
 * The calorimetry-run item of a reaction set: a seam for the calorimetry work. Until that lands a
 * run is stored as it is sent (`kind`, `id`, `label` checked; every other field kept unread) and
 * shown as "not evaluated". The calorimetry engineer replaces the loose object with the run's
 * real schema here; nothing else in reaction sets needs to change.
 */

/** Largest stored size of one run, in characters of JSON (a whole set stays under the 1 MB body limit). */
export const MAX_CALORIMETRY_RUN_CHARS = 100_000;

export const calorimetryRunItemSchema = z
  .looseObject({
    kind: z.literal('calorimetry-run'),
    id: z
      .string()
      .regex(/^[A-Za-z0-9_-]{1,64}$/, 'An item id is 1–64 letters, digits, - or _.')
      .optional(),
    label: plainText().trim().max(200).optional(),
  })
  .refine((run) => JSON.stringify(run).length <= MAX_CALORIMETRY_RUN_CHARS, {
    message: `A calorimetry run may take up to ${MAX_CALORIMETRY_RUN_CHARS.toLocaleString('en')} characters of JSON.`,
  });
export type CalorimetryRunItem = z.infer<typeof calorimetryRunItemSchema>;
