import Fraction from 'fraction.js';
import { eq } from 'drizzle-orm';
import { ChemistryError } from '@shared/chemistry/index';
import {
  consistencyFit,
  UndeterminedFitError,
  type ConsistencyMeasurement,
  type ConsistencyResult,
} from '@shared/chemistry/hess/index';
import type { AmendmentEntry, AmendmentImpact } from '@shared/schemas/amendments';
import type { ActorContext } from '../context';
import { teamDerivedValues, teams, type amendments } from '../db/tables/index';
import { AppError } from '../errors';
import { applyLibraryChanges, SetConflictError } from '../library/apply-set';
import { parseIdentity } from '../library/identities';
import { libraryNetworkOf } from '../library/network';
import { currentRevision, withNewRevision } from '../library/revisions';
import { loadSnapshot, selectedValue, type LibrarySnapshot } from '../library/snapshot';
import { impactReactionSources } from '../amendments/impact-sources';
import {
  planEntries,
  problemsFromApplier,
  type AmendmentPlan,
  type EntryProblem,
  type TeamValueRow,
} from '../amendments/plan';
import { measurementsInvolving } from './consistency.service';
import { teamRolesOf } from './membership.service';
import { enthalpyOnSnapshot } from './reaction-enthalpy.service';

/**
 * What accepting an amendment now would change. The amendment is applied inside a transaction
 * that takes the library write lock, the library at the would-be revision is read, and the
 * transaction is rolled back; everything else (evaluating reactions, derived values, the
 * consistency fit) runs afterwards, outside any transaction. The dry run is kept for the
 * amendment's version and the current revision, so reading the amendment again costs nothing.
 */

/** Most species whose consistency is checked in one impact (each is a small fit). */
export const MAX_CONSISTENCY_SPECIES = 50;

interface DryRun {
  revision: number;
  before: LibrarySnapshot;
  after: LibrarySnapshot | null;
  plan: AmendmentPlan;
  problems: EntryProblem[];
}

class Rollback extends Error {
  constructor(readonly snapshot: LibrarySnapshot) {
    super('dry run: rolled back on purpose');
  }
}
class Stale extends Error {}

const dryRuns = new Map<string, Promise<DryRun>>();
const DRY_RUNS_KEPT = 2;

type Row = typeof amendments.$inferSelect;

async function dryRunAt(
  ctx: ActorContext,
  row: Row,
  entries: readonly AmendmentEntry[],
  teamValues: ReadonlyMap<string, TeamValueRow>,
  revision: number,
): Promise<DryRun> {
  const before = await ctx.library.at(revision);
  const plan = planEntries({ snapshot: before, entries, title: row.title, teamValues, mode: 'apply' });
  if (plan.problems.length > 0) return { revision, before, after: null, plan, problems: plan.problems };
  try {
    await withNewRevision(ctx.db, { kind: 'amendment', summary: `dry run: ${row.title}` }, async (tx, number) => {
      if (number !== revision + 1) throw new Stale();
      await applyLibraryChanges(tx, plan.set, number);
      throw new Rollback(await loadSnapshot(tx, number));
    });
  } catch (error) {
    if (error instanceof Rollback) return { revision, before, after: error.snapshot, plan, problems: [] };
    if (error instanceof SetConflictError)
      return { revision, before, after: null, plan, problems: problemsFromApplier(error.problems) };
    throw error;
  }
  throw new Error('dry run: the transaction was not rolled back');
}

async function dryRun(
  ctx: ActorContext,
  row: Row,
  entries: readonly AmendmentEntry[],
  teamValues: ReadonlyMap<string, TeamValueRow>,
): Promise<DryRun> {
  for (let attempt = 0; attempt < 5; attempt++) {
    const revision = (await currentRevision(ctx.db))!;
    const key = `${row.id}:${row.version}:${revision}`;
    let run = dryRuns.get(key);
    if (!run) {
      run = dryRunAt(ctx, row, entries, teamValues, revision);
      dryRuns.set(key, run);
      run.catch(() => dryRuns.delete(key));
      while (dryRuns.size > DRY_RUNS_KEPT) dryRuns.delete(dryRuns.keys().next().value as string);
    }
    try {
      return await run;
    } catch (error) {
      if (!(error instanceof Stale)) throw error;
    }
  }
  throw new AppError('unavailable', 'The library is changing quickly; the impact could not be computed. Try again.');
}

type Energy = { value: number; uncertainty: number | null };

function selectedEnthalpy(snapshot: LibrarySnapshot, key: string): Energy | null {
  const entry = snapshot.speciesByKey.get(key);
  const value = entry ? selectedValue(snapshot, entry.id, 'dfH298') : null;
  return value ? { value: value.value, uncertainty: value.standardUncertainty } : null;
}

/** Species whose selected ΔfH° differs between the two snapshots, among those the plan names. */
function changedSpecies(run: DryRun, after: LibrarySnapshot): Set<string> {
  const named = new Set<string>();
  for (const identity of run.plan.targets) {
    const parsed = parseIdentity(identity);
    if (parsed && 'species' in parsed) named.add(parsed.species);
    if (parsed?.type === 'species') named.add(parsed.key);
  }
  const changed = new Set<string>();
  for (const key of named) {
    const a = selectedEnthalpy(run.before, key);
    const b = selectedEnthalpy(after, key);
    if (a?.value !== b?.value || a?.uncertainty !== b?.uncertainty) changed.add(key);
  }
  // Species of measured reactions the amendment changes: their Hess routes change too.
  for (const identity of run.plan.targets) {
    const parsed = parseIdentity(identity);
    if (parsed?.type !== 'reaction') continue;
    for (const snapshot of [run.before, after])
      for (const r of snapshot.reactions) if (r.key === parsed.key) for (const t of r.terms) changed.add(t.key);
  }
  return changed;
}

function entriesBySpecies(plan: AmendmentPlan): Map<string, number[]> {
  const out = new Map<string, number[]>();
  for (const item of plan.diff) {
    const key = item.target.speciesKey;
    if (!key) continue;
    const list = out.get(key) ?? [];
    if (!list.includes(item.entry)) list.push(item.entry);
    out.set(key, list);
  }
  return out;
}

async function reactionImpact(
  ctx: ActorContext,
  run: DryRun,
  after: LibrarySnapshot,
  changed: ReadonlySet<string>,
  bySpecies: Map<string, number[]>,
): Promise<AmendmentImpact['reactions']> {
  const out: AmendmentImpact['reactions'] = [];
  const evaluate = (snapshot: LibrarySnapshot, equation: string) => {
    try {
      return { ok: enthalpyOnSnapshot(snapshot, equation), problem: null };
    } catch (error) {
      if (error instanceof ChemistryError || error instanceof AppError) return { ok: null, problem: error.message };
      throw error;
    }
  };
  for (const source of impactReactionSources) {
    for (const reaction of await source.reactionsFor(ctx)) {
      const old = evaluate(run.before, reaction.equation);
      const next = evaluate(after, reaction.equation);
      const species = new Set([...(old.ok?.species ?? []), ...(next.ok?.species ?? [])]);
      if (![...species].some((k) => changed.has(k))) continue;
      const entries = [...new Set([...species].flatMap((k) => bySpecies.get(k) ?? []))].sort((a, b) => a - b);
      out.push({
        id: reaction.id,
        label: reaction.label,
        equation: next.ok?.equation ?? old.ok?.equation ?? reaction.equation,
        origin: reaction.origin,
        entries,
        old: old.ok ? { value: old.ok.deltaH, uncertainty: old.ok.uncertainty } : null,
        new: next.ok ? { value: next.ok.deltaH, uncertainty: next.ok.uncertainty } : null,
        change: old.ok && next.ok ? next.ok.deltaH - old.ok.deltaH : null,
        problem: next.problem ?? old.problem,
      });
    }
  }
  return out;
}

/** The value of one input of a derivation on a snapshot: a selected ΔfH° or a measured ΔrH at 298.15 K. */
function inputValue(snapshot: LibrarySnapshot, input: string): number | null {
  if (input.startsWith('formation:')) {
    const species = snapshot.species.get(input.slice('formation:'.length));
    const value = species ? selectedValue(snapshot, species.id, 'dfH298') : null;
    return value?.value ?? null;
  }
  if (input.startsWith('measured:')) {
    const reaction = libraryNetworkOf(snapshot).network.reactions.find((r) => r.id === input);
    return reaction ? reaction.deltaH.valueOf() : null;
  }
  return null;
}

interface StoredWeight {
  input: string;
  weight: string;
  label?: string;
}

/** The shift of a derived value: Σ weight × (input after − input before), over inputs present in both. */
function shiftOf(
  before: LibrarySnapshot,
  after: LibrarySnapshot,
  weights: readonly StoredWeight[],
): { change: number; inputs: AmendmentImpact['derivedValues'][number]['inputs'] } | null {
  const inputs: AmendmentImpact['derivedValues'][number]['inputs'] = [];
  let change = 0;
  for (const w of weights) {
    if (typeof w.input !== 'string' || typeof w.weight !== 'string') continue;
    const old = inputValue(before, w.input);
    const next = inputValue(after, w.input);
    if (old === null || next === null || old === next) continue;
    const weight = new Fraction(w.weight);
    change += weight.valueOf() * (next - old);
    inputs.push({ input: w.input, label: w.label ?? w.input, weight: weight.toFraction(), old, new: next });
  }
  return inputs.length > 0 ? { change, inputs } : null;
}

async function derivedValueImpact(
  ctx: ActorContext,
  run: DryRun,
  after: LibrarySnapshot,
): Promise<{ items: AmendmentImpact['derivedValues']; otherTeams: number }> {
  const items: AmendmentImpact['derivedValues'] = [];
  for (const values of after.values.values()) {
    for (const v of values) {
      const weights = v.derivation?.['weights'];
      if (!Array.isArray(weights)) continue;
      const shift = shiftOf(run.before, after, weights as StoredWeight[]);
      if (!shift) continue;
      items.push({
        kind: 'library',
        id: v.id,
        team: null,
        speciesKey: after.species.get(v.speciesId)?.key ?? v.speciesId,
        old: { value: v.value, uncertainty: v.standardUncertainty },
        new: { value: v.value + shift.change },
        change: shift.change,
        inputs: shift.inputs,
      });
    }
  }
  const [rows, roles] = await Promise.all([
    ctx.db
      .select({ value: teamDerivedValues, teamName: teams.name })
      .from(teamDerivedValues)
      .innerJoin(teams, eq(teams.id, teamDerivedValues.teamId)),
    teamRolesOf(ctx),
  ]);
  let otherTeams = 0;
  for (const { value, teamName } of rows) {
    const stored = (value.derivation as { inputs?: StoredWeight[] }).inputs ?? [];
    const shift = shiftOf(run.before, after, stored);
    if (!shift) continue;
    if (!roles.has(value.teamId)) {
      otherTeams++;
      continue;
    }
    const deltaH = Number(value.deltaH);
    items.push({
      kind: 'team',
      id: value.id,
      team: { id: value.teamId, name: teamName },
      speciesKey: value.speciesKey,
      old: { value: deltaH, uncertainty: value.uncertainty },
      new: { value: deltaH + shift.change },
      change: shift.change,
      inputs: shift.inputs,
    });
  }
  return { items, otherTeams };
}

/**
 * The consistency fit around one species: its independent measurements (other species held at
 * their library values) together with its selected value as one more measurement, when that
 * value has a stated uncertainty and rests on no measurements of the library (else it would
 * count them twice).
 */
function fitAround(
  snapshot: LibrarySnapshot,
  key: string,
): { fit: ConsistencyResult | null; measurements: ConsistencyMeasurement[]; withValue: boolean } | null {
  const entry = snapshot.speciesByKey.get(key);
  if (!entry) return null;
  const { measurements, held } = measurementsInvolving(snapshot, new Set([key]));
  if (measurements.length === 0) return null;
  const value = selectedValue(snapshot, entry.id, 'dfH298');
  const withValue =
    value !== null &&
    value.standardUncertainty !== null &&
    value.standardUncertainty > 0 &&
    !Array.isArray(value.derivation?.['weights']);
  const all = withValue
    ? [
        ...measurements,
        {
          id: `formation:${entry.id}`,
          label: `ΔfH°(${key}) as selected`,
          terms: [{ species: key, coefficient: new Fraction(1) }],
          deltaH: value.value,
          uncertainty: value.standardUncertainty!,
        },
      ]
    : measurements;
  try {
    return { fit: consistencyFit([key], all, held), measurements, withValue };
  } catch (error) {
    if (error instanceof UndeterminedFitError) return { fit: null, measurements, withValue };
    throw error;
  }
}

function consistencyImpact(
  run: DryRun,
  after: LibrarySnapshot,
  changed: ReadonlySet<string>,
  bySpecies: Map<string, number[]>,
): AmendmentImpact['consistency'] {
  const out: AmendmentImpact['consistency'] = [];
  for (const key of [...changed].sort().slice(0, MAX_CONSISTENCY_SPECIES)) {
    const proposed = selectedEnthalpy(after, key);
    if (!proposed) continue;
    const now = fitAround(after, key);
    if (!now) continue;
    const then = fitAround(run.before, key);
    const residual = (fit: ConsistencyResult | null | undefined, id: string) =>
      fit?.residuals.find((r) => r.id === id) ?? null;
    const fitted = now.fit?.fitted[0];
    out.push({
      species: key,
      entries: bySpecies.get(key) ?? [],
      proposed,
      fit: fitted ? { value: fitted.value, uncertainty: fitted.uncertainty } : null,
      birgeRatio: now.fit?.birgeRatio ?? null,
      measurements: now.measurements.flatMap((m) => {
        const after = residual(now.fit, m.id);
        if (!after) return [];
        const before = residual(then?.fit, m.id);
        return [
          {
            reaction: m.id,
            equation: m.label,
            normalizedBefore: before?.normalized ?? null,
            normalizedAfter: after.normalized,
            flaggedBefore: before?.flagged ?? false,
            flaggedAfter: after.flagged,
            becomesOutlier: after.flagged && !(before?.flagged ?? false),
          },
        ];
      }),
      note: now.fit
        ? now.withValue
          ? null
          : 'The proposed value has no stated uncertainty (or rests on measurements of the library): the fit uses the measurements alone.'
        : 'The measurements do not determine this species on their own.',
    });
  }
  return out;
}

/** The impact of accepting the amendment now (see the module comment). */
export async function computeImpact(
  ctx: ActorContext,
  input: { row: Row; entries: readonly AmendmentEntry[]; teamValues: ReadonlyMap<string, TeamValueRow> },
): Promise<AmendmentImpact> {
  const run = await dryRun(ctx, input.row, input.entries, input.teamValues);
  const empty = {
    revision: run.revision,
    reactions: [],
    derivedValues: [],
    otherTeamValues: 0,
    consistency: [],
  };
  if (!run.after)
    return {
      ...empty,
      status: 'does-not-apply',
      problems: run.problems.map((p) => ({
        entry: p.entry,
        message: p.field.length > 0 ? `${p.field.join('.')}: ${p.message}` : p.message,
      })),
    };
  const after = run.after;
  const changed = changedSpecies(run, after);
  const bySpecies = entriesBySpecies(run.plan);
  const [reactions, derived] = await Promise.all([
    reactionImpact(ctx, run, after, changed, bySpecies),
    derivedValueImpact(ctx, run, after),
  ]);
  return {
    ...empty,
    status: 'applies',
    problems: [],
    reactions,
    derivedValues: derived.items,
    otherTeamValues: derived.otherTeams,
    consistency: consistencyImpact(run, after, changed, bySpecies),
  };
}
