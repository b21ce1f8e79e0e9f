import { and, isNull, gt, lte, or, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import type {
  HeatCapacityForm,
  LibraryPhase,
  LibraryProperty,
  ModelScale,
  Provenance,
  SourceKind,
  UncertaintyKind,
} from '@shared/schemas/library-core';
import type { Executor } from '../db/client';
import {
  libraryModels,
  libraryReactions,
  librarySelections,
  librarySources,
  librarySpecies,
  libraryValues,
  type ReactionTermRow,
} from '../db/tables/index';
import { currentRevision } from './revisions';

/**
 * The whole library at one revision, held in memory: species, values, models, sources and
 * selections, with the lookups evaluation and search need. Built once per revision from the
 * temporal tables and shared by every request that reads that revision.
 */

export interface SourceEntry {
  id: string;
  key: string;
  kind: SourceKind;
  authors: string;
  title: string;
  publication: string | null;
  year: number | null;
  volume: string | null;
  pages: string | null;
  doi: string | null;
  isbn: string | null;
  url: string | null;
  note: string | null;
}

export interface SpeciesEntry {
  id: string;
  key: string;
  formula: string;
  hill: string;
  charge: number;
  phase: LibraryPhase;
  descriptor: string | null;
  name: string;
  synonyms: string[];
  cas: string | null;
  inchi: string | null;
  inchikey: string | null;
  referenceState: string | null;
  molarMass: number;
  note: string | null;
  validFrom: number;
}

export interface ValueEntry {
  id: string;
  speciesId: string;
  property: LibraryProperty;
  /** The value as a number (kJ/mol or J/(mol K)) and as the source printed it. */
  value: number;
  valueText: string;
  uncertaintyKind: UncertaintyKind;
  uncertaintyStated: number | null;
  coverageK: number | null;
  standardUncertainty: number | null;
  uncertaintyRule: string;
  sourceId: string;
  tableRef: string | null;
  entryNote: string | null;
  provenance: Provenance;
  provenanceNote: string | null;
  pressureBar: number;
  ionConvention: string | null;
  derivation: Record<string, unknown> | null;
  validFrom: number;
}

export interface ModelEntry {
  id: string;
  speciesId: string;
  sourceId: string;
  scale: ModelScale;
  forms: HeatCapacityForm[];
  tMin: number;
  tMax: number;
  entryNote: string | null;
  provenance: Provenance;
  provenanceNote: string | null;
  validFrom: number;
}

export interface SelectionEntry {
  speciesId: string;
  property: LibraryProperty | 'cp';
  valueId: string;
  reason: string;
  validFrom: number;
}

export interface ReactionEntry {
  id: string;
  key: string;
  equation: string;
  terms: ReactionTermRow[];
  /** kJ/mol per mole of reaction as written, as a number and as the source printed it. */
  deltaH: number;
  deltaHText: string;
  uncertaintyKind: UncertaintyKind;
  uncertaintyStated: number | null;
  coverageK: number | null;
  standardUncertainty: number | null;
  uncertaintyRule: string;
  temperature: number;
  method: string;
  molality: number | null;
  sourceId: string;
  tableRef: string | null;
  independent: boolean;
  provenance: Provenance;
  provenanceNote: string | null;
  validFrom: number;
}

export interface LibrarySnapshot {
  revision: number;
  species: Map<string, SpeciesEntry>;
  speciesByKey: Map<string, SpeciesEntry>;
  /** Species of one Hill formula and charge ("C2H6O|0"), every phase. */
  speciesByHill: Map<string, SpeciesEntry[]>;
  /** Reference-state species by element symbol. */
  referenceStates: Map<string, SpeciesEntry>;
  sources: Map<string, SourceEntry>;
  values: Map<string, ValueEntry[]>;
  models: Map<string, ModelEntry[]>;
  /** Selection per "speciesId|property". */
  selections: Map<string, SelectionEntry>;
  reactions: ReactionEntry[];
}

/** Rows valid at revision r: valid_from ≤ r and (valid_to is null or valid_to > r). */
function validAt(table: { validFrom: AnyPgColumn; validTo: AnyPgColumn }, revision: number): SQL {
  return and(lte(table.validFrom, revision), or(isNull(table.validTo), gt(table.validTo, revision)))!;
}

function push<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

const numberOrNull = (v: string | null): number | null => (v === null ? null : Number(v));

/** Reads the library at `revision` from the temporal tables. */
export async function loadSnapshot(db: Executor, revision: number): Promise<LibrarySnapshot> {
  const [sourceRows, speciesRows, valueRows, modelRows, selectionRows, reactionRows] = await Promise.all([
    db.select().from(librarySources).where(validAt(librarySources, revision)),
    db.select().from(librarySpecies).where(validAt(librarySpecies, revision)),
    db.select().from(libraryValues).where(validAt(libraryValues, revision)),
    db.select().from(libraryModels).where(validAt(libraryModels, revision)),
    db.select().from(librarySelections).where(validAt(librarySelections, revision)),
    db.select().from(libraryReactions).where(validAt(libraryReactions, revision)),
  ]);
  const snapshot: LibrarySnapshot = {
    revision,
    species: new Map(),
    speciesByKey: new Map(),
    speciesByHill: new Map(),
    referenceStates: new Map(),
    sources: new Map(),
    values: new Map(),
    models: new Map(),
    selections: new Map(),
    reactions: reactionRows
      .map((row) => ({
        id: row.id,
        key: row.key,
        equation: row.equation,
        terms: row.terms,
        deltaH: Number(row.deltaH),
        deltaHText: row.deltaH,
        uncertaintyKind: row.uncertaintyKind,
        uncertaintyStated: numberOrNull(row.uncertaintyStated),
        coverageK: row.coverageK,
        standardUncertainty: row.standardUncertainty,
        uncertaintyRule: row.uncertaintyRule,
        temperature: row.temperature,
        method: row.method,
        molality: row.molality,
        sourceId: row.sourceId,
        tableRef: row.tableRef,
        independent: row.independent,
        provenance: row.provenance,
        provenanceNote: row.provenanceNote,
        validFrom: row.validFrom,
      }))
      .sort((a, b) => (a.key < b.key ? -1 : 1)),
  };
  for (const row of sourceRows) {
    const { rowId: _r, validFrom: _f, validTo: _t, ...source } = row;
    snapshot.sources.set(source.id, source);
  }
  for (const row of speciesRows) {
    const { rowId: _r, validTo: _t, ...species } = row;
    snapshot.species.set(species.id, species);
    snapshot.speciesByKey.set(species.key, species);
    push(snapshot.speciesByHill, hillKey(species.hill, species.charge), species);
    if (species.referenceState) snapshot.referenceStates.set(species.referenceState, species);
  }
  for (const row of valueRows) {
    push(snapshot.values, row.speciesId, {
      id: row.id,
      speciesId: row.speciesId,
      property: row.property,
      value: Number(row.value),
      valueText: row.value,
      uncertaintyKind: row.uncertaintyKind,
      uncertaintyStated: numberOrNull(row.uncertaintyStated),
      coverageK: row.coverageK,
      standardUncertainty: row.standardUncertainty,
      uncertaintyRule: row.uncertaintyRule,
      sourceId: row.sourceId,
      tableRef: row.tableRef,
      entryNote: row.entryNote,
      provenance: row.provenance,
      provenanceNote: row.provenanceNote,
      pressureBar: row.pressureBar,
      ionConvention: row.ionConvention,
      derivation: row.derivation ?? null,
      validFrom: row.validFrom,
    });
  }
  for (const row of modelRows) {
    const { rowId: _r, validTo: _t, ...model } = row;
    push(snapshot.models, model.speciesId, model);
  }
  for (const row of selectionRows) {
    snapshot.selections.set(`${row.speciesId}|${row.property}`, {
      speciesId: row.speciesId,
      property: row.property,
      valueId: row.valueId,
      reason: row.reason,
      validFrom: row.validFrom,
    });
  }
  return snapshot;
}

/** Map key of a Hill formula with its charge. */
export function hillKey(hill: string, charge: number): string {
  return `${hill}|${charge}`;
}

/** The selected value of a property, or null. */
export function selectedValue(
  snapshot: LibrarySnapshot,
  speciesId: string,
  property: LibraryProperty,
): ValueEntry | null {
  const selection = snapshot.selections.get(`${speciesId}|${property}`);
  if (!selection) return null;
  return snapshot.values.get(speciesId)?.find((v) => v.id === selection.valueId) ?? null;
}

/** The selected heat-capacity model, or null. */
export function selectedModel(snapshot: LibrarySnapshot, speciesId: string): ModelEntry | null {
  const selection = snapshot.selections.get(`${speciesId}|cp`);
  if (!selection) return null;
  return snapshot.models.get(speciesId)?.find((m) => m.id === selection.valueId) ?? null;
}

/**
 * Keeps the snapshots of recent revisions in memory. Each read asks the database for the newest
 * revision number (one indexed row), so several servers on one PostgreSQL stay in step; the
 * snapshot itself is built once per revision.
 */
export class LibraryCache {
  private readonly snapshots = new Map<number, Promise<LibrarySnapshot>>();

  constructor(
    private readonly db: Executor,
    private readonly capacity = 4,
  ) {}

  /** The newest revision number, or null while the library is empty. */
  latestRevision(): Promise<number | null> {
    return currentRevision(this.db);
  }

  /** The snapshot at `revision` (which the caller has checked exists). */
  at(revision: number): Promise<LibrarySnapshot> {
    let snapshot = this.snapshots.get(revision);
    if (snapshot) {
      // Most recently used last, so eviction drops the oldest use.
      this.snapshots.delete(revision);
      this.snapshots.set(revision, snapshot);
      return snapshot;
    }
    snapshot = loadSnapshot(this.db, revision);
    snapshot.catch(() => this.snapshots.delete(revision));
    this.snapshots.set(revision, snapshot);
    while (this.snapshots.size > this.capacity) {
      const oldest = this.snapshots.keys().next().value as number;
      this.snapshots.delete(oldest);
    }
    return snapshot;
  }
}
