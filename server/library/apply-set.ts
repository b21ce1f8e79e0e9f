import { randomUUID } from 'node:crypto';
import { and, inArray, isNull } from 'drizzle-orm';
import type { AnyPgColumn, PgTable } from 'drizzle-orm/pg-core';
import { standardUncertainty, type StatedUncertainty } from '@shared/chemistry/thermo/index';
import type { LibraryProperty } from '@shared/schemas/library-core';
import type { Executor } from '../db/client';
import {
  libraryModels,
  libraryReactions,
  librarySelections,
  librarySources,
  librarySpecies,
  libraryValues,
} from '../db/tables/index';
import { identities, type SelectableProperty } from './identities';
import {
  statedRange,
  type DeprecationRecord,
  type ReactionRecord,
  type LibrarySet,
  type ModelRecord,
  type Origin,
  type SetProblem,
  type ValueRecord,
} from './seed-set';

/**
 * Writes a checked library set into the library as revision `revision` (which the caller has
 * created in the same transaction). Records are matched to the current library by identity —
 * sources by key, species by key, values by (species, property, source), models by
 * (species, source), selections by (species, property), reactions by key — and a record that
 * differs from the current row closes that row and inserts its successor (same stable id); an
 * identical record changes nothing. Deprecations close rows. Nothing is ever deleted.
 *
 * Only the rows the set names are read (a one-value amendment does not load the whole library),
 * and every identity written is reported, so a revision records what it touched.
 */

export interface ApplyCounts {
  sources: number;
  species: number;
  values: number;
  models: number;
  selections: number;
  reactions: number;
  /** Rows closed by deprecations (a species' own values, models and selections included). */
  deprecated: number;
}

export interface ApplyResult {
  counts: ApplyCounts;
  /** Identities of everything written (see identities.ts), sorted. */
  touched: string[];
}

export interface ApplyOptions {
  /**
   * The problem to report when a property is left with several values and none selected (the
   * seed asks for a row in selections.csv, an amendment for a select-value entry).
   */
  unselected?: (speciesKey: string, property: SelectableProperty) => SetProblem;
}

/** Thrown when a set that read cleanly cannot be applied to the current library. */
export class SetConflictError extends Error {
  constructor(readonly problems: SetProblem[]) {
    super(problems.map((p) => p.message).join(' '));
  }
}

/** The stated uncertainty of a value record in the shape the thermo core reads. */
export function statedUncertaintyOf(v: Pick<ValueRecord, 'uncertaintyKind' | 'uncertainty' | 'k'>): StatedUncertainty {
  if (v.uncertaintyKind === 'none' || v.uncertainty === null) return { kind: 'none' };
  const value = Number(v.uncertainty);
  if (v.uncertaintyKind === 'expanded') return { kind: 'expanded', value, k: v.k ?? Number.NaN };
  return { kind: v.uncertaintyKind, value };
}

const CHUNK = 500;

async function insertChunks<T>(rows: T[], insert: (chunk: T[]) => Promise<unknown>): Promise<void> {
  for (let i = 0; i < rows.length; i += CHUNK) await insert(rows.slice(i, i + CHUNK));
}

/** Rows of `table` (current ones only) whose `column` is one of `keys`, read in chunks. */
async function currentWhereIn<T extends PgTable & { validTo: AnyPgColumn }>(
  tx: Executor,
  table: T,
  column: AnyPgColumn,
  keys: Iterable<string>,
): Promise<T['$inferSelect'][]> {
  const list = [...new Set(keys)];
  const rows: T['$inferSelect'][] = [];
  for (let i = 0; i < list.length; i += CHUNK) {
    const chunk = list.slice(i, i + CHUNK);
    // The query builder cannot see that `table` has the columns passed with it.
    const found = (await tx
      .select()
      .from(table as PgTable)
      .where(and(inArray(column, chunk), isNull(table.validTo)))) as T['$inferSelect'][];
    rows.push(...found);
  }
  return rows;
}

/** Closes rows (valid_to = revision) by row id, in chunks: one statement per chunk, not per row. */
async function closeRows(
  tx: Executor,
  table: PgTable & { rowId: AnyPgColumn },
  rowIds: number[],
  revision: number,
): Promise<void> {
  for (let i = 0; i < rowIds.length; i += CHUNK) {
    await tx
      .update(table)
      .set({ validTo: revision } as never)
      .where(inArray(table.rowId, rowIds.slice(i, i + CHUNK)));
  }
}

/** Same content, compared as JSON of the fields that define it (ids and validity left out). */
function sameContent(a: Record<string, unknown>, b: Record<string, unknown>, fields: string[]): boolean {
  return fields.every((f) => JSON.stringify(a[f] ?? null) === JSON.stringify(b[f] ?? null));
}

function numericEqual(a: string | null, b: string | null): boolean {
  if (a === null || b === null) return a === b;
  return Number(a) === Number(b) && a.replace(/0+$/, '') === b.replace(/0+$/, '');
}

/** Every species and source key a set names, so only those rows are read. */
function keysNamed(set: LibrarySet): { species: Set<string>; sources: Set<string>; reactions: Set<string> } {
  const species = new Set<string>(set.species.map((s) => s.key));
  const sources = new Set<string>(set.sources.map((s) => s.key));
  const reactions = new Set<string>(set.reactions.map((r) => r.key));
  for (const r of [...set.values, ...set.models, ...set.selections]) {
    species.add(r.species);
    sources.add(r.source);
  }
  for (const r of set.reactions) {
    sources.add(r.source);
    for (const t of r.terms) if (!t.finiteMolality) species.add(t.key);
  }
  for (const d of set.deprecations ?? []) {
    if (d.target === 'source') sources.add(d.key);
    else if (d.target === 'reaction') reactions.add(d.key);
    else species.add(d.key);
    if (d.source) sources.add(d.source);
  }
  return { species, sources, reactions };
}

export async function applyLibrarySet(tx: Executor, set: LibrarySet, revision: number): Promise<ApplyCounts> {
  return (await applyLibraryChanges(tx, set, revision)).counts;
}

export async function applyLibraryChanges(
  tx: Executor,
  set: LibrarySet,
  revision: number,
  options: ApplyOptions = {},
): Promise<ApplyResult> {
  const counts: ApplyCounts = {
    sources: 0,
    species: 0,
    values: 0,
    models: 0,
    selections: 0,
    reactions: 0,
    deprecated: 0,
  };
  const touched = new Set<string>();
  const named = keysNamed(set);

  // Sources by key.
  const currentSources = await currentWhereIn(tx, librarySources, librarySources.key, named.sources);
  const sourceByKey = new Map(currentSources.map((s) => [s.key, s]));
  const sourceIdByKey = new Map(currentSources.map((s) => [s.key, s.id]));
  const sourceFields = [
    'kind',
    'authors',
    'title',
    'publication',
    'year',
    'volume',
    'pages',
    'doi',
    'isbn',
    'url',
    'note',
  ];
  const newSources: (typeof librarySources.$inferInsert)[] = [];
  const closedSources: number[] = [];
  for (const s of set.sources) {
    const current = sourceByKey.get(s.key);
    if (current && sameContent(current, s as unknown as Record<string, unknown>, sourceFields)) continue;
    if (current) closedSources.push(current.rowId);
    const id = current?.id ?? randomUUID();
    sourceIdByKey.set(s.key, id);
    const { origin: _, ...fields } = s;
    newSources.push({ ...fields, id, validFrom: revision });
    touched.add(identities.source(s.key));
  }
  await closeRows(tx, librarySources, closedSources, revision);
  await insertChunks(newSources, (chunk) => tx.insert(librarySources).values(chunk));
  counts.sources = newSources.length;

  // Species by key.
  const currentSpecies = await currentWhereIn(tx, librarySpecies, librarySpecies.key, named.species);
  const speciesByKey = new Map(currentSpecies.map((s) => [s.key, s]));
  const speciesIdByKey = new Map(currentSpecies.map((s) => [s.key, s.id]));
  const speciesFields = [
    'formula',
    'hill',
    'charge',
    'phase',
    'descriptor',
    'name',
    'synonyms',
    'cas',
    'inchi',
    'inchikey',
    'referenceState',
    'molarMass',
    'note',
  ];
  const newSpecies: (typeof librarySpecies.$inferInsert)[] = [];
  const closedSpecies: number[] = [];
  for (const s of set.species) {
    const current = speciesByKey.get(s.key);
    if (current && sameContent(current, s as unknown as Record<string, unknown>, speciesFields)) continue;
    if (current) closedSpecies.push(current.rowId);
    const id = current?.id ?? randomUUID();
    speciesIdByKey.set(s.key, id);
    const { origin: _, ...fields } = s;
    newSpecies.push({ ...fields, id, validFrom: revision });
    touched.add(identities.species(s.key));
  }
  await closeRows(tx, librarySpecies, closedSpecies, revision);
  await insertChunks(newSpecies, (chunk) => tx.insert(librarySpecies).values(chunk));
  counts.species = newSpecies.length;
  const speciesKeyById = new Map([...speciesIdByKey].map(([key, id]) => [id, key]));

  const missing: SetProblem[] = [];
  const speciesId = (record: { species: string; origin: Origin }) => {
    const id = speciesIdByKey.get(record.species);
    if (!id) missing.push({ ...record.origin, column: 'species', message: `unknown species ${record.species}.` });
    return id ?? '';
  };
  const sourceId = (record: { source: string; origin: Origin }) => {
    const id = sourceIdByKey.get(record.source);
    if (!id) missing.push({ ...record.origin, column: 'source', message: `unknown source ${record.source}.` });
    return id ?? '';
  };

  // The current values, models and selections of the species named (to match, select and deprecate).
  const involvedSpecies = [...speciesIdByKey.values()];
  const [currentValues, currentModels, currentSelections] = await Promise.all([
    currentWhereIn(tx, libraryValues, libraryValues.speciesId, involvedSpecies),
    currentWhereIn(tx, libraryModels, libraryModels.speciesId, involvedSpecies),
    currentWhereIn(tx, librarySelections, librarySelections.speciesId, involvedSpecies),
  ]);
  // Their sources too, so every identity written can be named by keys.
  const sourceKeyById = new Map([...sourceIdByKey].map(([key, id]) => [id, key]));
  const unknownSources = [...currentValues, ...currentModels]
    .map((r) => r.sourceId)
    .filter((id) => !sourceKeyById.has(id));
  for (const s of await currentWhereIn(tx, librarySources, librarySources.id, unknownSources))
    sourceKeyById.set(s.id, s.key);
  const speciesKeyOf = (id: string) => speciesKeyById.get(id) ?? id;
  const sourceKeyOf = (id: string) => sourceKeyById.get(id) ?? id;

  // Values by (species, property, source).
  const valueKey = (sp: string, property: string, src: string) => `${sp}|${property}|${src}`;
  const valueByKey = new Map(currentValues.map((v) => [valueKey(v.speciesId, v.property, v.sourceId), v]));
  const valueIdByKey = new Map(currentValues.map((v) => [valueKey(v.speciesId, v.property, v.sourceId), v.id]));
  const newValues: (typeof libraryValues.$inferInsert)[] = [];
  const closedValues: number[] = [];
  for (const v of set.values) {
    const sp = speciesId(v);
    const src = sourceId(v);
    const derived = standardUncertainty(statedUncertaintyOf(v));
    const row = {
      speciesId: sp,
      property: v.property,
      value: v.value,
      uncertaintyKind: v.uncertaintyKind,
      uncertaintyStated: v.uncertainty,
      coverageK: v.k,
      standardUncertainty: derived.u,
      uncertaintyRule: derived.rule,
      sourceId: src,
      tableRef: v.table,
      entryNote: v.entryNote,
      provenance: v.provenance,
      provenanceNote: v.note,
      pressureBar: v.pressureBar,
      ionConvention: v.ionConvention,
      derivation: v.derivation ?? null,
    };
    const key = valueKey(sp, v.property, src);
    const current = valueByKey.get(key);
    if (
      current &&
      numericEqual(current.value, row.value) &&
      numericEqual(current.uncertaintyStated, row.uncertaintyStated) &&
      sameContent(current, row, [
        'uncertaintyKind',
        'coverageK',
        'tableRef',
        'entryNote',
        'provenance',
        'provenanceNote',
        'pressureBar',
        'ionConvention',
        'derivation',
      ])
    )
      continue;
    if (current) closedValues.push(current.rowId);
    const id = current?.id ?? randomUUID();
    valueIdByKey.set(key, id);
    newValues.push({ ...row, id, validFrom: revision });
    touched.add(identities.value(v.species, v.property, v.source));
  }

  // Models by (species, source).
  const modelKey = (sp: string, src: string) => `${sp}|${src}`;
  const modelByKey = new Map(currentModels.map((m) => [modelKey(m.speciesId, m.sourceId), m]));
  const modelIdByKey = new Map(currentModels.map((m) => [modelKey(m.speciesId, m.sourceId), m.id]));
  const newModels: (typeof libraryModels.$inferInsert)[] = [];
  const closedModels: number[] = [];
  for (const m of set.models) {
    const sp = speciesId(m);
    const src = sourceId(m);
    const row = modelRow(m, sp, src);
    const key = modelKey(sp, src);
    const current = modelByKey.get(key);
    if (current && sameContent(current, row, ['scale', 'forms', 'entryNote', 'provenance', 'provenanceNote'])) continue;
    if (current) closedModels.push(current.rowId);
    const id = current?.id ?? randomUUID();
    modelIdByKey.set(key, id);
    newModels.push({ ...row, id, validFrom: revision });
    touched.add(identities.model(m.species, m.source));
  }
  if (missing.length > 0) throw new SetConflictError(missing);
  await closeRows(tx, libraryValues, closedValues, revision);
  await closeRows(tx, libraryModels, closedModels, revision);
  await insertChunks(newValues, (chunk) => tx.insert(libraryValues).values(chunk));
  await insertChunks(newModels, (chunk) => tx.insert(libraryModels).values(chunk));
  counts.values = newValues.length;
  counts.models = newModels.length;

  // Deprecations close rows; what they close leaves the candidates for selection.
  const selectionKey = (sp: string, property: string) => `${sp}|${property}`;
  const selectionByKey = new Map(currentSelections.map((s) => [selectionKey(s.speciesId, s.property), s]));
  const deprecation = await deprecate(tx, set.deprecations ?? [], revision, {
    speciesIdByKey,
    sourceIdByKey,
    valueByKey,
    valueIdByKey,
    modelByKey,
    modelIdByKey,
    selectionByKey,
    valueKey,
    modelKey,
    speciesKeyOf,
    sourceKeyOf,
    touched,
  });
  counts.deprecated = deprecation.closed;

  // Selections: explicit ones from the set; a property with exactly one candidate is selected by default.
  const wanted = new Map<
    string,
    { speciesId: string; property: LibraryProperty | 'cp'; valueId: string; reason: string }
  >();
  for (const s of set.selections) {
    const sp = speciesId(s);
    const src = sourceId(s);
    const valueId =
      s.property === 'cp' ? modelIdByKey.get(modelKey(sp, src)) : valueIdByKey.get(valueKey(sp, s.property, src));
    if (!valueId) {
      missing.push({
        ...s.origin,
        column: 'source',
        message: `there is no ${s.property} of ${s.species} from ${s.source} to select.`,
      });
      continue;
    }
    wanted.set(selectionKey(sp, s.property), { speciesId: sp, property: s.property, valueId, reason: s.reason });
  }
  if (missing.length > 0) throw new SetConflictError(missing);
  const candidates = new Map<string, string[]>();
  for (const [key, id] of valueIdByKey) {
    const [sp, property] = key.split('|') as [string, string, string];
    const list = candidates.get(selectionKey(sp, property)) ?? [];
    list.push(id);
    candidates.set(selectionKey(sp, property), list);
  }
  for (const [key, id] of modelIdByKey) {
    const [sp] = key.split('|') as [string, string];
    const list = candidates.get(selectionKey(sp, 'cp')) ?? [];
    list.push(id);
    candidates.set(selectionKey(sp, 'cp'), list);
  }
  const unselected: string[] = [];
  for (const [key, ids] of candidates) {
    if (wanted.has(key)) continue;
    const current = selectionByKey.get(key);
    if (current && ids.includes(current.valueId)) continue;
    const [sp, property] = key.split('|') as [string, LibraryProperty | 'cp'];
    if (ids.length === 1) {
      wanted.set(key, { speciesId: sp, property, valueId: ids[0]!, reason: 'the only value in the library' });
    } else unselected.push(key);
  }
  if (unselected.length > 0) {
    throw new SetConflictError(
      unselected.map((key) => {
        const [sp, property] = key.split('|') as [string, SelectableProperty];
        const species = speciesKeyOf(sp);
        return (
          options.unselected?.(species, property) ?? {
            file: 'selections.csv',
            line: 1,
            message: `${property} of ${species} has several values: select one in selections.csv.`,
          }
        );
      }),
    );
  }
  const newSelections: (typeof librarySelections.$inferInsert)[] = [];
  const closedSelections: number[] = [];
  for (const [key, s] of wanted) {
    const current = selectionByKey.get(key);
    if (current && current.valueId === s.valueId && current.reason === s.reason) continue;
    if (current) closedSelections.push(current.rowId);
    newSelections.push({ ...s, validFrom: revision });
    touched.add(identities.selection(speciesKeyOf(s.speciesId), s.property));
  }
  // A selection whose every candidate was deprecated closes with them.
  for (const [key, current] of selectionByKey) {
    if (wanted.has(key) || candidates.has(key)) continue;
    closedSelections.push(current.rowId);
    touched.add(identities.selection(speciesKeyOf(current.speciesId), current.property));
  }
  await closeRows(tx, librarySelections, closedSelections, revision);
  await insertChunks(newSelections, (chunk) => tx.insert(librarySelections).values(chunk));
  counts.selections = newSelections.length;
  counts.reactions = await applyReactions(tx, set.reactions, revision, speciesIdByKey, sourceId, touched, deprecation);
  await checkDeprecations(tx, deprecation);
  return { counts, touched: [...touched].sort() };
}

interface DeprecationState {
  speciesIdByKey: Map<string, string>;
  sourceIdByKey: Map<string, string>;
  valueByKey: Map<string, typeof libraryValues.$inferSelect>;
  valueIdByKey: Map<string, string>;
  modelByKey: Map<string, typeof libraryModels.$inferSelect>;
  modelIdByKey: Map<string, string>;
  selectionByKey: Map<string, typeof librarySelections.$inferSelect>;
  valueKey: (sp: string, property: string, src: string) => string;
  modelKey: (sp: string, src: string) => string;
  speciesKeyOf: (id: string) => string;
  sourceKeyOf: (id: string) => string;
  touched: Set<string>;
}

interface DeprecationOutcome {
  closed: number;
  /** Species and sources closed, with the record that closed them (checked once everything is written). */
  species: { id: string; record: DeprecationRecord }[];
  sources: { id: string; record: DeprecationRecord }[];
  reactions: Set<string>;
}

/** Closes the rows the deprecations name; a species takes its values, models and selections with it. */
async function deprecate(
  tx: Executor,
  records: readonly DeprecationRecord[],
  revision: number,
  state: DeprecationState,
): Promise<DeprecationOutcome> {
  const outcome: DeprecationOutcome = { closed: 0, species: [], sources: [], reactions: new Set() };
  if (records.length === 0) return outcome;
  const problems: SetProblem[] = [];
  const closed = { values: [] as number[], models: [] as number[], selections: [] as number[] };
  const closeValue = (key: string) => {
    const row = state.valueByKey.get(key);
    if (!row || !state.valueIdByKey.has(key)) return false;
    closed.values.push(row.rowId);
    state.valueIdByKey.delete(key);
    state.touched.add(
      identities.value(state.speciesKeyOf(row.speciesId), row.property, state.sourceKeyOf(row.sourceId)),
    );
    return true;
  };
  const closeModel = (key: string) => {
    const row = state.modelByKey.get(key);
    if (!row || !state.modelIdByKey.has(key)) return false;
    closed.models.push(row.rowId);
    state.modelIdByKey.delete(key);
    state.touched.add(identities.model(state.speciesKeyOf(row.speciesId), state.sourceKeyOf(row.sourceId)));
    return true;
  };
  const speciesRows = await currentWhereIn(
    tx,
    librarySpecies,
    librarySpecies.key,
    records.filter((r) => r.target === 'species').map((r) => r.key),
  );
  const sourceRows = await currentWhereIn(
    tx,
    librarySources,
    librarySources.key,
    records.filter((r) => r.target === 'source').map((r) => r.key),
  );
  const reactionRows = await currentWhereIn(
    tx,
    libraryReactions,
    libraryReactions.key,
    records.filter((r) => r.target === 'reaction').map((r) => r.key),
  );
  const closedSpecies: number[] = [];
  const closedSources: number[] = [];
  const closedReactions: number[] = [];
  for (const d of records) {
    const fail = (message: string) => problems.push({ ...d.origin, message });
    switch (d.target) {
      case 'value': {
        const sp = state.speciesIdByKey.get(d.key);
        const src = d.source ? state.sourceIdByKey.get(d.source) : undefined;
        if (!sp || !src || !d.property || !closeValue(state.valueKey(sp, d.property, src)))
          fail(`there is no current ${d.property ?? 'value'} of ${d.key} from ${d.source ?? '?'} to deprecate.`);
        break;
      }
      case 'model': {
        const sp = state.speciesIdByKey.get(d.key);
        const src = d.source ? state.sourceIdByKey.get(d.source) : undefined;
        if (!sp || !src || !closeModel(state.modelKey(sp, src)))
          fail(`there is no current heat-capacity model of ${d.key} from ${d.source ?? '?'} to deprecate.`);
        break;
      }
      case 'species': {
        const row = speciesRows.find((s) => s.key === d.key);
        if (!row) {
          fail(`there is no current species ${d.key} to deprecate.`);
          break;
        }
        closedSpecies.push(row.rowId);
        state.touched.add(identities.species(row.key));
        for (const key of [...state.valueIdByKey.keys()]) if (key.startsWith(`${row.id}|`)) closeValue(key);
        for (const key of [...state.modelIdByKey.keys()]) if (key.startsWith(`${row.id}|`)) closeModel(key);
        for (const [key, selection] of state.selectionByKey) {
          if (selection.speciesId !== row.id) continue;
          closed.selections.push(selection.rowId);
          state.selectionByKey.delete(key);
          state.touched.add(identities.selection(row.key, selection.property));
        }
        state.speciesIdByKey.delete(row.key);
        outcome.species.push({ id: row.id, record: d });
        break;
      }
      case 'reaction': {
        const row = reactionRows.find((r) => r.key === d.key);
        if (!row) {
          fail(`there is no current measured reaction ${d.key} to deprecate.`);
          break;
        }
        closedReactions.push(row.rowId);
        outcome.reactions.add(row.key);
        state.touched.add(identities.reaction(row.key));
        break;
      }
      case 'source': {
        const row = sourceRows.find((s) => s.key === d.key);
        if (!row) {
          fail(`there is no current source ${d.key} to deprecate.`);
          break;
        }
        closedSources.push(row.rowId);
        state.sourceIdByKey.delete(row.key);
        state.touched.add(identities.source(row.key));
        outcome.sources.push({ id: row.id, record: d });
        break;
      }
    }
  }
  if (problems.length > 0) throw new SetConflictError(problems);
  await closeRows(tx, libraryValues, closed.values, revision);
  await closeRows(tx, libraryModels, closed.models, revision);
  await closeRows(tx, librarySelections, closed.selections, revision);
  await closeRows(tx, librarySpecies, closedSpecies, revision);
  await closeRows(tx, libraryReactions, closedReactions, revision);
  await closeRows(tx, librarySources, closedSources, revision);
  outcome.closed =
    closed.values.length +
    closed.models.length +
    closed.selections.length +
    closedSpecies.length +
    closedReactions.length +
    closedSources.length;
  return outcome;
}

/**
 * Once everything is written: a deprecated species must not be used by a current measured
 * reaction, and a deprecated source must not be cited by a current value, model or reaction.
 */
async function checkDeprecations(tx: Executor, outcome: DeprecationOutcome): Promise<void> {
  if (outcome.species.length === 0 && outcome.sources.length === 0) return;
  const problems: SetProblem[] = [];
  if (outcome.species.length > 0) {
    const reactions = await tx.select().from(libraryReactions).where(isNull(libraryReactions.validTo));
    for (const { id, record } of outcome.species) {
      const users = reactions.filter((r) => r.terms.some((t) => t.speciesId === id)).map((r) => r.key);
      if (users.length > 0)
        problems.push({
          ...record.origin,
          message: `species ${record.key} is used by the measured reaction(s) ${users.join(', ')}: deprecate or correct them too.`,
        });
    }
  }
  if (outcome.sources.length > 0) {
    const ids = outcome.sources.map((s) => s.id);
    const [values, models, reactions] = await Promise.all([
      currentWhereIn(tx, libraryValues, libraryValues.sourceId, ids),
      currentWhereIn(tx, libraryModels, libraryModels.sourceId, ids),
      currentWhereIn(tx, libraryReactions, libraryReactions.sourceId, ids),
    ]);
    for (const { id, record } of outcome.sources) {
      const cited =
        values.filter((v) => v.sourceId === id).length +
        models.filter((m) => m.sourceId === id).length +
        reactions.filter((r) => r.sourceId === id).length;
      if (cited > 0)
        problems.push({
          ...record.origin,
          message: `source ${record.key} is still cited by ${cited} value(s), model(s) or reaction(s): deprecate or re-source them too.`,
        });
    }
  }
  if (problems.length > 0) throw new SetConflictError(problems);
}

/** Measured reactions by key; their species resolve to library ids (finite-molality solutes stay keys). */
async function applyReactions(
  tx: Executor,
  reactions: ReactionRecord[],
  revision: number,
  speciesIdByKey: Map<string, string>,
  sourceId: (record: { source: string; origin: Origin }) => string,
  touched: Set<string>,
  deprecation: DeprecationOutcome,
): Promise<number> {
  if (reactions.length === 0) return 0;
  const problems: SetProblem[] = [];
  const current = await currentWhereIn(
    tx,
    libraryReactions,
    libraryReactions.key,
    reactions.map((r) => r.key),
  );
  const byKey = new Map(current.map((r) => [r.key, r]));
  const rows: (typeof libraryReactions.$inferInsert)[] = [];
  const closed: number[] = [];
  for (const r of reactions) {
    if (deprecation.reactions.has(r.key)) {
      problems.push({ ...r.origin, column: 'key', message: `reaction ${r.key} is both revised and deprecated.` });
      continue;
    }
    const terms = r.terms.map((t) => {
      const speciesId = t.finiteMolality ? null : (speciesIdByKey.get(t.key) ?? null);
      if (!t.finiteMolality && !speciesId)
        problems.push({ ...r.origin, column: 'equation', message: `unknown species ${t.key}.` });
      return { speciesId, key: t.key, coefficient: t.coefficient };
    });
    const derived = standardUncertainty(statedUncertaintyOf(r));
    const row = {
      key: r.key,
      equation: r.equation,
      terms,
      deltaH: r.deltaH,
      uncertaintyKind: r.uncertaintyKind,
      uncertaintyStated: r.uncertainty,
      coverageK: r.k,
      standardUncertainty: derived.u,
      uncertaintyRule: derived.rule,
      temperature: r.temperature,
      method: r.method,
      molality: r.molality,
      sourceId: sourceId(r),
      tableRef: r.table,
      independent: r.independent,
      provenance: r.provenance,
      provenanceNote: r.note,
    };
    const existing = byKey.get(r.key);
    if (
      existing &&
      numericEqual(existing.deltaH, row.deltaH) &&
      numericEqual(existing.uncertaintyStated, row.uncertaintyStated) &&
      sameContent(existing, row, [
        'equation',
        'terms',
        'uncertaintyKind',
        'coverageK',
        'temperature',
        'method',
        'molality',
        'sourceId',
        'tableRef',
        'independent',
        'provenance',
        'provenanceNote',
      ])
    )
      continue;
    if (existing) closed.push(existing.rowId);
    rows.push({ ...row, id: existing?.id ?? randomUUID(), validFrom: revision });
    touched.add(identities.reaction(r.key));
  }
  if (problems.length > 0) throw new SetConflictError(problems);
  await closeRows(tx, libraryReactions, closed, revision);
  await insertChunks(rows, (chunk) => tx.insert(libraryReactions).values(chunk));
  return rows.length;
}

function modelRow(m: ModelRecord, speciesId: string, sourceId: string) {
  const [tMin, tMax] = statedRange(m);
  return {
    speciesId,
    sourceId,
    scale: m.scale,
    forms: m.forms,
    tMin,
    tMax,
    entryNote: m.entryNote,
    provenance: m.provenance,
    provenanceNote: m.provenanceNote,
  };
}

/** Whether the library holds no revision yet (the seed step runs only then). */
export async function libraryIsEmpty(tx: Executor): Promise<boolean> {
  const rows = await tx.select({ id: librarySpecies.id }).from(librarySpecies).limit(1);
  return rows.length === 0;
}
