import { z } from 'zod';
import { deriveInputSchema, deriveResultSchema } from './derive';
import { plainText } from './text';

/** A team's derived ΔfH° (kJ/mol at 298.15 K, standard uncertainty), with its derivation. */
export const derivedValueSchema = z.object({
  id: z.uuid(),
  teamId: z.uuid(),
  speciesKey: z.string(),
  librarySpeciesId: z.uuid().nullable(),
  deltaFH: z.object({ value: z.number(), uncertainty: z.number().nullable(), unit: z.literal('kJ/mol') }),
  uncertaintyMissing: z.array(z.string()),
  /** What was asked and what the combiner answered, as it was at the time. */
  derivation: z.object({ request: deriveInputSchema, result: deriveResultSchema }),
  libraryRevision: z.number().int(),
  note: z.string().nullable(),
  createdBy: z.string(),
  createdAt: z.iso.datetime({ offset: true }),
});
export type DerivedValue = z.infer<typeof derivedValueSchema>;

export const derivedValueListSchema = z.object({ items: z.array(derivedValueSchema) });

/** POST /api/v1/teams/:teamId/derived-values: the derivation is run again on the server. */
export const derivedValueInputSchema = z.object({
  derivation: deriveInputSchema.omit({ teamId: true, maxRoutes: true }),
  note: plainText().max(2_000).optional(),
});
export type DerivedValueInput = z.infer<typeof derivedValueInputSchema>;

export const derivedValueParamsSchema = z.object({ teamId: z.uuid(), valueId: z.uuid() });
