import { randomUUID } from 'node:crypto';
import { eq, isNull } from 'drizzle-orm';
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
import {
  statedRange,
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
 * (species, source), selections by (species, property) — and a record that differs from the
 * current row closes that row and inserts its successor; an identical record changes nothing.
 * Nothing is deleted: removing things is a deprecation, a change of its own.
 */

export interface ApplyCounts {
  sources: number;
  species: number;
  values: number;
  models: number;
  selections: number;
  reactions: number;
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

/** Same content, compared as JSON of the fields that define it (ids and validity left out). */
function sameContent(a: Record<string, unknown>, b: Record<string, unknown>, fields: string[]): boolean {
  return fields.every((f) => JSON.stringify(a[f] ?? null) === JSON.stringify(b[f] ?? null));
}

function numericEqual(a: string | null, b: string | null): boolean {
  if (a === null || b === null) return a === b;
  return Number(a) === Number(b) && a.replace(/0+$/, '') === b.replace(/0+$/, '');
}

export async function applyLibrarySet(tx: Executor, set: LibrarySet, revision: number): Promise<ApplyCounts> {
  const counts: ApplyCounts = { sources: 0, species: 0, values: 0, models: 0, selections: 0, reactions: 0 };
  const close = { validTo: revision };

  // Sources by key.
  const currentSources = await tx.select().from(librarySources).where(isNull(librarySources.validTo));
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
  for (const s of set.sources) {
    const current = sourceByKey.get(s.key);
    if (current && sameContent(current, s as unknown as Record<string, unknown>, sourceFields)) continue;
    if (current) await tx.update(librarySources).set(close).where(eq(librarySources.rowId, current.rowId));
    const id = current?.id ?? randomUUID();
    sourceIdByKey.set(s.key, id);
    const { origin: _, ...fields } = s;
    newSources.push({ ...fields, id, validFrom: revision });
  }
  await insertChunks(newSources, (chunk) => tx.insert(librarySources).values(chunk));
  counts.sources = newSources.length;

  // Species by key.
  const currentSpecies = await tx.select().from(librarySpecies).where(isNull(librarySpecies.validTo));
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
  for (const s of set.species) {
    const current = speciesByKey.get(s.key);
    if (current && sameContent(current, s as unknown as Record<string, unknown>, speciesFields)) continue;
    if (current) await tx.update(librarySpecies).set(close).where(eq(librarySpecies.rowId, current.rowId));
    const id = current?.id ?? randomUUID();
    speciesIdByKey.set(s.key, id);
    const { origin: _, ...fields } = s;
    newSpecies.push({ ...fields, id, validFrom: revision });
  }
  await insertChunks(newSpecies, (chunk) => tx.insert(librarySpecies).values(chunk));
  counts.species = newSpecies.length;

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

  // Values by (species, property, source).
  const currentValues = await tx.select().from(libraryValues).where(isNull(libraryValues.validTo));
  const valueKey = (sp: string, property: string, src: string) => `${sp}|${property}|${src}`;
  const valueByKey = new Map(currentValues.map((v) => [valueKey(v.speciesId, v.property, v.sourceId), v]));
  const valueIdByKey = new Map(currentValues.map((v) => [valueKey(v.speciesId, v.property, v.sourceId), v.id]));
  const newValues: (typeof libraryValues.$inferInsert)[] = [];
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
      ])
    )
      continue;
    if (current) await tx.update(libraryValues).set(close).where(eq(libraryValues.rowId, current.rowId));
    const id = current?.id ?? randomUUID();
    valueIdByKey.set(key, id);
    newValues.push({ ...row, id, validFrom: revision });
  }

  // Models by (species, source).
  const currentModels = await tx.select().from(libraryModels).where(isNull(libraryModels.validTo));
  const modelKey = (sp: string, src: string) => `${sp}|${src}`;
  const modelByKey = new Map(currentModels.map((m) => [modelKey(m.speciesId, m.sourceId), m]));
  const modelIdByKey = new Map(currentModels.map((m) => [modelKey(m.speciesId, m.sourceId), m.id]));
  const newModels: (typeof libraryModels.$inferInsert)[] = [];
  for (const m of set.models) {
    const sp = speciesId(m);
    const src = sourceId(m);
    const row = modelRow(m, sp, src);
    const key = modelKey(sp, src);
    const current = modelByKey.get(key);
    if (current && sameContent(current, row, ['scale', 'forms', 'entryNote', 'provenance', 'provenanceNote'])) continue;
    if (current) await tx.update(libraryModels).set(close).where(eq(libraryModels.rowId, current.rowId));
    const id = current?.id ?? randomUUID();
    modelIdByKey.set(key, id);
    newModels.push({ ...row, id, validFrom: revision });
  }
  if (missing.length > 0) throw new SetConflictError(missing);
  await insertChunks(newValues, (chunk) => tx.insert(libraryValues).values(chunk));
  await insertChunks(newModels, (chunk) => tx.insert(libraryModels).values(chunk));
  counts.values = newValues.length;
  counts.models = newModels.length;

  // Selections: explicit ones from the set; a property with exactly one candidate is selected by default.
  const currentSelections = await tx.select().from(librarySelections).where(isNull(librarySelections.validTo));
  const selectionKey = (sp: string, property: string) => `${sp}|${property}`;
  const selectionByKey = new Map(currentSelections.map((s) => [selectionKey(s.speciesId, s.property), s]));
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
    const keyOf = new Map([...speciesIdByKey].map(([k, id]) => [id, k]));
    throw new SetConflictError(
      unselected.map((key) => {
        const [sp, property] = key.split('|') as [string, string];
        return {
          file: 'selections.csv',
          line: 1,
          message: `${property} of ${keyOf.get(sp) ?? sp} has several values: select one in selections.csv.`,
        };
      }),
    );
  }
  const newSelections: (typeof librarySelections.$inferInsert)[] = [];
  for (const [key, s] of wanted) {
    const current = selectionByKey.get(key);
    if (current && current.valueId === s.valueId && current.reason === s.reason) continue;
    if (current) await tx.update(librarySelections).set(close).where(eq(librarySelections.rowId, current.rowId));
    newSelections.push({ ...s, validFrom: revision });
  }
  await insertChunks(newSelections, (chunk) => tx.insert(librarySelections).values(chunk));
  counts.selections = newSelections.length;
  counts.reactions = await applyReactions(tx, set.reactions, revision, speciesIdByKey, sourceId);
  return counts;
}

/** Measured reactions by key; their species resolve to library ids (finite-molality solutes stay keys). */
async function applyReactions(
  tx: Executor,
  reactions: ReactionRecord[],
  revision: number,
  speciesIdByKey: Map<string, string>,
  sourceId: (record: { source: string; origin: Origin }) => string,
): Promise<number> {
  if (reactions.length === 0) return 0;
  const problems: SetProblem[] = [];
  const current = await tx.select().from(libraryReactions).where(isNull(libraryReactions.validTo));
  const byKey = new Map(current.map((r) => [r.key, r]));
  const rows: (typeof libraryReactions.$inferInsert)[] = [];
  for (const r of reactions) {
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
    if (existing)
      await tx.update(libraryReactions).set({ validTo: revision }).where(eq(libraryReactions.rowId, existing.rowId));
    rows.push({ ...row, id: existing?.id ?? randomUUID(), validFrom: revision });
  }
  if (problems.length > 0) throw new SetConflictError(problems);
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
