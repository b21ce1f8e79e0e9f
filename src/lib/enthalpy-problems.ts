/**
 * The 422 replies of the reaction-enthalpy API (species not in the library, ambiguous, no model
 * at T) read into problems the panel can show, each with the library keys offered instead and the
 * species in the equation they would replace. Pure.
 */
import { z } from 'zod';
import { identityOfKey, type SpeciesIdentity } from './species-suggestions';

const speciesProblemsSchema = z.object({
  species: z.array(
    z.object({
      term: z.number().int(),
      species: z.string(),
      reason: z.string(),
      message: z.string(),
      candidates: z.array(z.string()),
    }),
  ),
});

const rangeProblemsSchema = z.object({
  temperature: z.number(),
  alternatives: z.record(z.string(), z.array(z.string())),
});

export interface EnthalpyProblem {
  /** The species as named in the message ("H2O", "H2O(l)"). */
  species: string;
  /** Stable reason: missing, phase-missing, ambiguous, out-of-range… */
  reason: string;
  message: string | null;
  /** The species in the equation a suggestion replaces; null when it cannot be told. */
  target: SpeciesIdentity | null;
  /** Library keys offered instead. */
  candidates: string[];
}

/**
 * Problems from the error details, or an empty list when the details carry none (the message then
 * says it all). `sentTerms` are the identities of the terms of the equation as sent, in order.
 */
export function enthalpyProblems(details: unknown, sentTerms: readonly SpeciesIdentity[]): EnthalpyProblem[] {
  const bySpecies = speciesProblemsSchema.safeParse(details);
  if (bySpecies.success)
    return bySpecies.data.species.map((p) => ({
      species: p.species,
      reason: p.reason,
      message: p.message,
      target: sentTerms[p.term] ?? null,
      candidates: p.candidates,
    }));
  const byRange = rangeProblemsSchema.safeParse(details);
  if (byRange.success)
    return Object.entries(byRange.data.alternatives).map(([key, candidates]) => ({
      species: key,
      reason: 'out-of-range',
      message: null,
      target: identityOfKey(key),
      candidates,
    }));
  return [];
}
