import Fraction from 'fraction.js';
import { desc, eq } from 'drizzle-orm';
import { molarMass, parseFormula } from '@shared/chemistry/index';
import type { InputInfo, KnownReaction } from '@shared/chemistry/hess/index';
import type { Executor } from '../db/client';
import { teamDerivedValues } from '../db/tables/index';
import { exact } from './network';
import { selectedValue, type LibrarySnapshot } from './snapshot';

/** The inputs a saved team value rests on, as stored with it (weights as exact fraction text). */
export interface StoredInput {
  input: string;
  weight: string;
  label: string;
  uncertainty: number | null;
}

/** A team value as the evaluation sees it: the species and its ΔfH° with uncertainty. */
export interface TeamValue {
  id: string;
  key: string;
  formula: string;
  hill: string;
  charge: number;
  phase: string;
  descriptor: string | null;
  molarMass: number;
  deltaH: number;
  deltaHText: string;
  uncertainty: number | null;
  inputs: StoredInput[];
}

/** The newest value per species of a team, for species the library (at this revision) has no ΔfH° for. */
export async function teamValuesOf(
  db: Executor,
  teamId: string,
  snapshot: LibrarySnapshot,
  warnings: { code: string; message: string }[],
): Promise<TeamValue[]> {
  const rows = await db
    .select()
    .from(teamDerivedValues)
    .where(eq(teamDerivedValues.teamId, teamId))
    .orderBy(desc(teamDerivedValues.createdAt));
  const seen = new Set<string>();
  const values: TeamValue[] = [];
  for (const row of rows) {
    if (seen.has(row.speciesKey)) continue;
    seen.add(row.speciesKey);
    const entry = snapshot.speciesByKey.get(row.speciesKey);
    if (entry && selectedValue(snapshot, entry.id, 'dfH298')) {
      warnings.push({
        code: 'team_value_superseded',
        message: `The library now has a ΔfH° for ${row.speciesKey}; the team's derived value is not used.`,
      });
      continue;
    }
    const parsed = parseFormula(row.speciesKey);
    values.push({
      id: row.id,
      key: row.speciesKey,
      formula: row.formula,
      hill: row.hill,
      charge: row.charge,
      phase: row.phase,
      descriptor: row.descriptor,
      molarMass: parsed.electron ? 0 : molarMass(parsed.composition).value,
      deltaH: Number(row.deltaH),
      deltaHText: row.deltaH,
      uncertainty: row.uncertainty,
      inputs: ((row.derivation as { inputs?: StoredInput[] }).inputs ?? []) as StoredInput[],
    });
  }
  return values;
}

/**
 * Team values as formation reactions for the combiner, each resting on the inputs it was derived
 * from (so a route that also uses those measurements counts them once). Inputs the current
 * library does not hold (the derivation's own given reactions) are carried with their
 * uncertainties under the value's name.
 */
export function teamValuesAsReactions(
  values: readonly TeamValue[],
  warnings: { code: string; message: string }[],
): { reactions: KnownReaction[]; inputs: Map<string, InputInfo> } {
  const inputs = new Map<string, InputInfo>();
  const reactions = values.map((v): KnownReaction => {
    const basis = v.inputs.map((i) => {
      // The derivation's given reactions are not in the library: name them after the value.
      const id = i.input.startsWith('given:') ? `derived:${v.id}:${i.input}` : i.input;
      if (!inputs.has(id)) inputs.set(id, { id, label: i.label, uncertainty: i.uncertainty });
      return { input: id, weight: new Fraction(i.weight) };
    });
    return {
      id: `derived:${v.id}`,
      kind: 'formation',
      refId: v.id,
      equation: `formation of ${v.key} (team's derived value)`,
      terms: [{ species: v.key, coefficient: new Fraction(1) }],
      deltaH: exact(v.deltaHText),
      uncertainty: v.uncertainty,
      ...(basis.length > 0 ? { basis } : {}),
      source: "the team's derived value",
    };
  });
  if (values.length > 0)
    warnings.push({
      code: 'team_values_used',
      message: `The team's derived values are available for ${values.map((v) => v.key).join(', ')} (marked as derived where used).`,
    });
  return { reactions, inputs };
}
