import Fraction from 'fraction.js';
import { and, desc, eq } from 'drizzle-orm';
import { parseFormula } from '@shared/chemistry/index';
import type { DeriveInput, DeriveResult } from '@shared/schemas/derive';
import type { DerivedValue, DerivedValueInput } from '@shared/schemas/derived-values';
import type { ActorContext, ServiceContext } from '../context';
import { teamDerivedValues } from '../db/tables/index';
import { AppError, errors } from '../errors';
import type { StoredInput } from '../library/team-values';
import { selectedValue } from '../library/snapshot';
import { runDerivation } from './derive.service';

/**
 * A team's own derived formation enthalpies: saved from a derivation that the server runs again,
 * kept outside the shared library, and used in that team's derivations and evaluations (marked as
 * derived). Proposing one to the library goes through an amendment.
 */

type Row = typeof teamDerivedValues.$inferSelect;

function present(row: Row): DerivedValue {
  const derivation = row.derivation as { request: DeriveInput; result: DeriveResult };
  return {
    id: row.id,
    teamId: row.teamId,
    speciesKey: row.speciesKey,
    librarySpeciesId: row.librarySpeciesId,
    deltaFH: { value: Number(row.deltaH), uncertainty: row.uncertainty, unit: 'kJ/mol' },
    uncertaintyMissing: row.uncertaintyMissing,
    derivation: { request: derivation.request, result: derivation.result },
    libraryRevision: row.libraryRevision,
    note: row.note,
    createdBy: row.createdByName,
    createdAt: row.createdAt.toISOString(),
  };
}

/** The team's derived values, newest first. */
export async function listDerivedValues(
  ctx: ServiceContext,
  { teamId }: { teamId: string },
): Promise<{ items: DerivedValue[] }> {
  const rows = await ctx.db
    .select()
    .from(teamDerivedValues)
    .where(eq(teamDerivedValues.teamId, teamId))
    .orderBy(desc(teamDerivedValues.createdAt));
  return { items: rows.map(present) };
}

/**
 * Runs the derivation again on the server and saves its ΔH as the team's ΔfH° of the target's
 * species. The target must be the formation of one species (elements in their reference states →
 * 1 species) that the library has no ΔfH° for.
 */
export async function saveDerivedValue(
  ctx: ActorContext,
  input: DerivedValueInput & { teamId: string },
): Promise<DerivedValue> {
  const request: DeriveInput = { ...input.derivation, teamId: input.teamId };
  const run = await runDerivation(ctx, request);
  const { result, derivation } = run;
  const formed = run.targetTerms.filter((t) => !run.referenceKeys.has(t.species.key));
  const [product] = formed;
  if (formed.length !== 1 || !product || !product.coefficient.equals(1))
    throw errors.validation(
      ['body', 'derivation', 'target'],
      'The target must be the formation of one species from elements in their reference states, e.g. 7 C(cr, graphite) + 4 H2(g) + O2(g) -> C7H8O2(cr).',
    );
  if (result.status !== 'derived' || result.deltaH === null)
    throw new AppError('unprocessable', 'The derivation found no route, so there is no value to save.', {
      unreachable: result.unreachable ?? [],
    });
  const key = product.species.key;
  const libraryEntry = run.snapshot.speciesByKey.get(key);
  if (libraryEntry && selectedValue(run.snapshot, libraryEntry.id, 'dfH298'))
    throw errors.conflict(
      `The library already has a ΔfH° for ${key}: propose a change to the library instead of a team value.`,
      { species: key },
    );
  const parsed = parseFormula(key);
  // The inputs the saved value rests on: the headline's weights over independent inputs.
  const weights = new Map<string, Fraction>();
  const combined = derivation.basis === 'combined' && derivation.combination;
  const complete = derivation.routes.filter((r) => r.missing.length === 0);
  const sources = combined
    ? complete.map((r, i) => ({ route: r, factor: derivation.combination!.weights[i]! }))
    : [{ route: derivation.routes[0]!, factor: 1 }];
  for (const { route, factor } of sources)
    for (const [id, w] of route.weights) {
      const scaled = w.mul(new Fraction(factor.toPrecision(15)));
      weights.set(id, (weights.get(id) ?? new Fraction(0)).add(scaled));
    }
  const stored: StoredInput[] = [...weights]
    .filter(([, w]) => !w.equals(0))
    .map(([id, w]) => {
      const info = run.inputs.get(id);
      return { input: id, weight: w.toFraction(), label: info?.label ?? id, uncertainty: info?.uncertainty ?? null };
    });
  const [row] = await ctx.db
    .insert(teamDerivedValues)
    .values({
      teamId: input.teamId,
      speciesKey: key,
      formula: parsed.formula,
      hill: parsed.hill,
      charge: parsed.charge,
      phase: product.species.phase ?? 'cr',
      descriptor: parsed.descriptor,
      librarySpeciesId: libraryEntry?.id ?? null,
      deltaH: String(result.deltaH.value),
      uncertainty: result.uncertaintyComplete ? result.deltaH.uncertainty : null,
      uncertaintyMissing: result.uncertaintyMissing,
      derivation: { request, result, inputs: stored },
      libraryRevision: result.libraryRevision,
      note: input.note ?? null,
      createdBy: ctx.actor.user.id,
      createdByName: ctx.actor.user.displayName,
    })
    .returning();
  return present(row!);
}

export async function deleteDerivedValue(
  ctx: ActorContext,
  { teamId, valueId }: { teamId: string; valueId: string },
): Promise<void> {
  const [row] = await ctx.db
    .delete(teamDerivedValues)
    .where(and(eq(teamDerivedValues.id, valueId), eq(teamDerivedValues.teamId, teamId)))
    .returning({ id: teamDerivedValues.id });
  if (!row) throw errors.notFound('The derived value');
}
