import { createHash } from 'node:crypto';
import { parseFormula } from '@shared/chemistry/index';
import { standardUncertainty, thermoModelIssues, ThermoInputError } from '@shared/chemistry/thermo/index';
import type { AmendmentEntry, CitedSource, DiffItem, DiffSide, SourceInput } from '@shared/schemas/amendments';
import { propertyUnits, type LibraryProperty, type UncertaintyKind } from '@shared/schemas/library-core';
import type { teamDerivedValues } from '../db/tables/index';
import { identities, identityLabel, type SelectableProperty } from '../library/identities';
import { citationOf } from '../library/present';
import {
  casCheckDigitValid,
  readSpeciesKey,
  statedRange,
  toReaction,
  type LibrarySet,
  type ModelRecord,
  type Origin,
  type ReactionRecord,
  type SetProblem,
  type SourceRecord,
  type ValueRecord,
} from '../library/seed-set';
import {
  hillKey,
  type LibrarySnapshot,
  type ModelEntry,
  type ReactionEntry,
  type SourceEntry,
  type SpeciesEntry,
  type ValueEntry,
} from '../library/snapshot';

/**
 * Plans an amendment against one library snapshot: resolves every entry (ids and keys, sources
 * by id, key or citation), checks it, and turns it into the applier's records (a partial
 * LibrarySet with deprecations), the diff per entry and the identities it changes.
 *
 * Planned against the base revision it gives the diff the reviewers read ('review': every check
 * the snapshot allows). Planned against the current revision at acceptance it gives the records
 * to apply ('apply': only what resolving needs; whether a reaction's species still exist, a
 * deprecated source is still cited, a species is still used — the applier decides that inside
 * the transaction, against the library as it is then).
 */

export type TeamValueRow = typeof teamDerivedValues.$inferSelect & { teamName: string };

export interface PlanInput {
  snapshot: LibrarySnapshot;
  entries: readonly AmendmentEntry[];
  /** For default selection reasons. */
  title: string;
  /** The team derived values named by team-value entries (by id), as the caller may see them. */
  teamValues: ReadonlyMap<string, TeamValueRow>;
  mode: 'review' | 'apply';
}

export interface EntryProblem {
  /** Entry index, or null for the amendment as a whole. */
  entry: number | null;
  /** Path inside the entry ("species", "deltaFH.uncertainty" as ["deltaFH", "uncertainty"]). */
  field: (string | number)[];
  message: string;
}

export interface PlannedSource {
  id: string | null;
  key: string;
  citation: string;
  isNew: boolean;
}

export interface AmendmentPlan {
  set: LibrarySet;
  diff: DiffItem[];
  /** Identities the entries change (sorted). */
  targets: string[];
  /** The species each entry is about (null for sources and reactions). */
  entrySpecies: ({ key: string; id: string | null } | null)[];
  sources: PlannedSource[];
  problems: EntryProblem[];
}

/** The source values derived by Hess's law in the product cite unless a team names another. */
export const DERIVED_SOURCE_KEY = 'thermoledger-derivations';

const derivedSourceRecord = (origin: Origin): SourceRecord => ({
  origin,
  key: DERIVED_SOURCE_KEY,
  kind: 'dataset',
  authors: 'Thermoledger',
  title: "Formation enthalpies derived by Hess's law in Thermoledger",
  publication: null,
  year: null,
  volume: null,
  pages: null,
  doi: null,
  isbn: null,
  url: null,
  note: 'Each value records its derivation: the reactions, their multipliers and the weights of the inputs it rests on.',
});

/** The origin an amendment's records carry: `line` is the entry index (from 0). */
export const entryOrigin = (index: number): Origin => ({ file: 'entries', line: index });

/** The applier's problems, re-addressed to entries (records of an amendment carry their entry index). */
export function problemsFromApplier(problems: readonly SetProblem[]): EntryProblem[] {
  return problems.map((p) =>
    p.file === 'entries'
      ? { entry: p.line, field: p.column ? [p.column] : [], message: p.message }
      : { entry: null, field: [], message: p.message },
  );
}

/** A number as decimal text for a numeric column. */
export function numberText(n: number): string {
  return String(n);
}

/** A stable key for a source given only by its citation: the same words give the same key. */
export function citationKey(citation: string): string {
  const normalised = citation.normalize('NFC').replace(/\s+/g, ' ').trim().toLowerCase();
  return `cited-${createHash('sha256').update(normalised).digest('hex').slice(0, 10)}`;
}

/** A stable key for a measured reaction given without one. */
export function reactionKey(equation: string): string {
  const normalised = equation.replace(/\s+/g, ' ').trim();
  return `reaction-${createHash('sha256').update(normalised).digest('hex').slice(0, 10)}`;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function side(parts: Partial<DiffSide>): DiffSide {
  return {
    value: null,
    valueText: null,
    uncertainty: null,
    unit: null,
    source: null,
    provenance: null,
    text: null,
    ...parts,
  };
}

interface SpeciesRef {
  key: string;
  id: string | null;
  referenceState: string | null;
}

interface SourceRef {
  key: string;
  id: string | null;
  citation: string;
}

/** Fields of a source record as they are compared with a library source. */
const sourceContentFields = [
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
] as const;

function citedSourceRecord(cited: CitedSource, key: string, origin: Origin): SourceRecord {
  return {
    origin,
    key,
    kind: cited.kind ?? 'report',
    authors: cited.authors ?? '',
    title: cited.title ?? cited.citation,
    publication: cited.publication ?? null,
    year: cited.year ?? null,
    volume: cited.volume ?? null,
    pages: cited.pages ?? null,
    doi: cited.doi ?? null,
    isbn: null,
    url: cited.url ?? null,
    note: cited.citation,
  };
}

function modelText(model: { scale: string; forms: ModelRecord['forms'] }, species: string): string {
  const [tMin, tMax] = statedRange({ species, scale: model.scale as ModelRecord['scale'], forms: model.forms });
  const kinds = [...new Set(model.forms.map((f) => f.model.kind))].join(', ');
  return `${kinds}, ${tMin}–${tMax} K, ${model.scale} scale${model.forms.length > 1 ? `, ${model.forms.length} forms` : ''}`;
}

/** Plans the entries against the snapshot (see the module comment). */
export function planEntries(input: PlanInput): AmendmentPlan {
  return new Planner(input).run();
}

class Planner {
  private readonly snapshot: LibrarySnapshot;
  private readonly review: boolean;
  private readonly set: LibrarySet = {
    sources: [],
    species: [],
    values: [],
    models: [],
    selections: [],
    reactions: [],
    deprecations: [],
  };
  private readonly diff: DiffItem[] = [];
  private readonly targets = new Set<string>();
  private readonly entrySpecies: AmendmentPlan['entrySpecies'] = [];
  private readonly sources = new Map<string, PlannedSource>();
  private readonly problems: EntryProblem[] = [];
  private index = 0;

  // What earlier entries of the amendment add or remove.
  private readonly addedSpecies = new Map<string, SpeciesRef>();
  private readonly deprecatedSpecies = new Set<string>();
  private readonly addedSources = new Map<string, SourceRecord>();
  private readonly deprecatedSources = new Set<string>();
  private readonly addedValues = new Map<string, DiffSide>();
  private readonly addedModels = new Map<string, DiffSide>();
  private readonly deprecatedRows = new Set<string>();
  private readonly deprecatedReactions = new Set<string>();
  /** Selected identity per "species|property" after the earlier entries. */
  private readonly selected = new Map<string, string | null>();
  /** Deprecated selected values/models whose species-property must get a new selection. */
  private readonly reselect = new Map<string, number>();

  private readonly sourceByKey: Map<string, SourceEntry>;
  private valueById: Map<string, ValueEntry> | null = null;
  private modelById: Map<string, ModelEntry> | null = null;

  constructor(private readonly input: PlanInput) {
    this.snapshot = input.snapshot;
    this.review = input.mode === 'review';
    this.sourceByKey = new Map([...this.snapshot.sources.values()].map((s) => [s.key, s]));
  }

  run(): AmendmentPlan {
    this.input.entries.forEach((entry, i) => {
      this.index = i;
      this.entrySpecies.push(null);
      this.plan(entry);
    });
    if (this.review) {
      for (const [key, entry] of this.reselect) {
        const [species, property] = key.split('|') as [string, SelectableProperty];
        if (this.candidates(species, property) > 1 && !this.explicitlySelected.has(key))
          this.problems.push({
            entry,
            field: ['id'],
            message: `it deprecates the selected ${identityLabel(identities.selection(species, property)).replace(/^the selected /, '')}, which leaves several candidates: add a select-value entry choosing one.`,
          });
      }
      if (this.problems.length === 0 && this.diff.every((d) => d.action === 'unchanged'))
        this.problems.push({
          entry: null,
          field: [],
          message: `The amendment changes nothing in the library at revision ${this.snapshot.revision}.`,
        });
    }
    return {
      set: this.set,
      diff: this.diff,
      targets: [...this.targets].sort(),
      entrySpecies: this.entrySpecies,
      sources: [...this.sources.values()],
      problems: this.problems,
    };
  }

  private readonly explicitlySelected = new Set<string>();

  private problem(field: (string | number)[], message: string): void {
    this.problems.push({ entry: this.index, field, message });
  }

  private get origin(): Origin {
    return entryOrigin(this.index);
  }

  private get at(): string {
    return `at revision ${this.snapshot.revision}`;
  }

  // ——— Resolution ———

  private species(ref: string, field: (string | number)[]): SpeciesRef | null {
    if (uuidPattern.test(ref)) {
      const entry = this.snapshot.species.get(ref);
      if (!entry || this.deprecatedSpecies.has(entry.key)) {
        this.problem(field, `there is no species with id ${ref} in the library ${this.at}.`);
        return null;
      }
      return { key: entry.key, id: entry.id, referenceState: entry.referenceState };
    }
    const added = this.addedSpecies.get(ref);
    if (added) return added;
    const entry = this.snapshot.speciesByKey.get(ref);
    if (!entry || this.deprecatedSpecies.has(ref)) {
      this.problem(
        field,
        `there is no species ${ref} in the library ${this.at}: write its library key (or id), or add it with a set-species entry before this one.`,
      );
      return null;
    }
    return { key: entry.key, id: entry.id, referenceState: entry.referenceState };
  }

  private note(source: SourceRef, isNew: boolean): void {
    if (!this.sources.has(source.key)) this.sources.set(source.key, { ...source, isNew });
  }

  private source(ref: SourceInput, field: (string | number)[]): SourceRef | null {
    if (typeof ref === 'string') {
      const entry = this.snapshot.sources.get(ref);
      if (!entry || this.deprecatedSources.has(entry.key)) {
        this.problem(field, `there is no source with id ${ref} in the library ${this.at}.`);
        return null;
      }
      const found = { key: entry.key, id: entry.id, citation: citationOf(entry) };
      this.note(found, false);
      return found;
    }
    if (!('citation' in ref)) {
      const added = this.addedSources.get(ref.key);
      if (added) return { key: added.key, id: null, citation: citationOf(added) };
      const entry = this.sourceByKey.get(ref.key);
      if (!entry || this.deprecatedSources.has(ref.key)) {
        this.problem([...field, 'key'], `there is no source ${ref.key} in the library ${this.at}.`);
        return null;
      }
      const found = { key: entry.key, id: entry.id, citation: citationOf(entry) };
      this.note(found, false);
      return found;
    }
    const key = ref.key ?? citationKey(ref.citation);
    const record = citedSourceRecord(ref, key, this.origin);
    const added = this.addedSources.get(key);
    const existing = this.sourceByKey.get(key);
    const same = (other: Record<string, unknown>) =>
      sourceContentFields.every((f) => (other[f] ?? null) === (record[f] ?? null));
    if (added) {
      if (!same(added as unknown as Record<string, unknown>)) {
        this.problem([...field, 'key'], `source ${key} is added differently earlier in this amendment.`);
        return null;
      }
      return { key, id: null, citation: citationOf(added) };
    }
    if (existing && !this.deprecatedSources.has(key)) {
      if (!same(existing as unknown as Record<string, unknown>)) {
        this.problem(
          [...field, 'key'],
          `source key ${key} is already the library's ${citationOf(existing)}: refer to it by id, or give another key.`,
        );
        return null;
      }
      const found = { key, id: existing.id, citation: citationOf(existing) };
      this.note(found, false);
      return found;
    }
    this.set.sources.push(record);
    this.addedSources.set(key, record);
    const found = { key, id: null, citation: citationOf(record) };
    this.note(found, true);
    return found;
  }

  /** The project's own source for derived values, added on first use. */
  private derivedSource(): SourceRef {
    const existing = this.sourceByKey.get(DERIVED_SOURCE_KEY);
    if (existing && !this.deprecatedSources.has(DERIVED_SOURCE_KEY)) {
      const found = { key: existing.key, id: existing.id, citation: citationOf(existing) };
      this.note(found, false);
      return found;
    }
    let record = this.addedSources.get(DERIVED_SOURCE_KEY);
    if (!record) {
      record = derivedSourceRecord(this.origin);
      this.set.sources.push(record);
      this.addedSources.set(DERIVED_SOURCE_KEY, record);
    }
    const found = { key: record.key, id: null, citation: citationOf(record) };
    this.note(found, true);
    return found;
  }

  private sourceSide(key: string): DiffSide['source'] {
    const planned = this.sources.get(key);
    if (planned) return { id: planned.id, key, citation: planned.citation };
    const entry = this.sourceByKey.get(key);
    return entry ? { id: entry.id, key, citation: citationOf(entry) } : { id: null, key, citation: key };
  }

  private currentValue(species: SpeciesRef, property: LibraryProperty, sourceKey: string): ValueEntry | null {
    if (!species.id) return null;
    const source = this.sourceByKey.get(sourceKey);
    if (!source) return null;
    const value = this.snapshot.values
      .get(species.id)
      ?.find((v) => v.property === property && v.sourceId === source.id);
    if (!value || this.deprecatedRows.has(identities.value(species.key, property, sourceKey))) return null;
    return value;
  }

  private currentModel(species: SpeciesRef, sourceKey: string): ModelEntry | null {
    if (!species.id) return null;
    const source = this.sourceByKey.get(sourceKey);
    if (!source) return null;
    const model = this.snapshot.models.get(species.id)?.find((m) => m.sourceId === source.id);
    if (!model || this.deprecatedRows.has(identities.model(species.key, sourceKey))) return null;
    return model;
  }

  private valueSide(value: ValueEntry): DiffSide {
    const source = this.snapshot.sources.get(value.sourceId);
    return side({
      value: value.value,
      valueText: value.valueText,
      uncertainty: value.standardUncertainty,
      unit: propertyUnits[value.property],
      source: source ? { id: source.id, key: source.key, citation: citationOf(source) } : null,
      provenance: value.provenance,
    });
  }

  private modelSide(model: ModelEntry, speciesKey: string): DiffSide {
    const source = this.snapshot.sources.get(model.sourceId);
    return side({
      source: source ? { id: source.id, key: source.key, citation: citationOf(source) } : null,
      provenance: model.provenance,
      text: modelText(model, speciesKey),
    });
  }

  /** The identity selected for a species' property now (after the earlier entries). */
  private selectedIdentity(species: SpeciesRef, property: SelectableProperty): string | null {
    const key = `${species.key}|${property}`;
    if (this.selected.has(key)) return this.selected.get(key) ?? null;
    if (!species.id) return null;
    const selection = this.snapshot.selections.get(`${species.id}|${property}`);
    if (!selection) return null;
    if (property === 'cp') {
      const model = this.snapshot.models.get(species.id)?.find((m) => m.id === selection.valueId);
      const source = model && this.snapshot.sources.get(model.sourceId);
      return source ? identities.model(species.key, source.key) : null;
    }
    const value = this.snapshot.values.get(species.id)?.find((v) => v.id === selection.valueId);
    const source = value && this.snapshot.sources.get(value.sourceId);
    return source ? identities.value(species.key, property, source.key) : null;
  }

  /** The diff side of an identity (a value or model of the library, or one added earlier). */
  private sideOf(identity: string | null, species: SpeciesRef): DiffSide | null {
    if (!identity) return null;
    const added = this.addedValues.get(identity) ?? this.addedModels.get(identity);
    if (added) return added;
    const [type, rest] = [identity.slice(0, identity.indexOf(':')), identity.slice(identity.indexOf(':') + 1)];
    const parts = rest.split('|');
    if (type === 'value') {
      const value = this.currentValue(species, parts[1] as LibraryProperty, parts[2]!);
      return value ? this.valueSide(value) : null;
    }
    const model = this.currentModel(species, parts[1]!);
    return model ? this.modelSide(model, species.key) : null;
  }

  /** How many values (or models) a species' property has after the earlier entries. */
  private candidates(speciesKey: string, property: SelectableProperty): number {
    const entry = this.snapshot.speciesByKey.get(speciesKey);
    const prefix = property === 'cp' ? `model:${speciesKey}|` : `value:${speciesKey}|${property}|`;
    const ids = new Set<string>();
    if (entry) {
      if (property === 'cp')
        for (const m of this.snapshot.models.get(entry.id) ?? []) {
          const s = this.snapshot.sources.get(m.sourceId);
          if (s) ids.add(identities.model(speciesKey, s.key));
        }
      else
        for (const v of this.snapshot.values.get(entry.id) ?? []) {
          const s = this.snapshot.sources.get(v.sourceId);
          if (v.property === property && s) ids.add(identities.value(speciesKey, property, s.key));
        }
    }
    for (const id of [...this.addedValues.keys(), ...this.addedModels.keys()]) if (id.startsWith(prefix)) ids.add(id);
    for (const id of this.deprecatedRows) ids.delete(id);
    return ids.size;
  }

  /** Makes `identity` the selection of the species' property unless it already is. */
  private select(
    species: SpeciesRef,
    property: SelectableProperty,
    sourceKey: string,
    identity: string,
    reason: string,
    to: DiffSide,
  ): DiffItem['selection'] {
    const key = `${species.key}|${property}`;
    this.explicitlySelected.add(key);
    const now = this.selectedIdentity(species, property);
    if (now === identity) return null;
    const from = this.sideOf(now, species);
    this.set.selections.push({ origin: this.origin, species: species.key, property, source: sourceKey, reason });
    this.selected.set(key, identity);
    this.targets.add(identities.selection(species.key, property));
    return { from, to };
  }

  private defaultReason(): string {
    return `proposed in the amendment “${this.input.title}”`;
  }

  private target(
    type: DiffItem['target']['type'],
    identity: string,
    species: SpeciesRef | null,
    property: DiffItem['target']['property'],
  ): DiffItem['target'] {
    return {
      type,
      label: identityLabel(identity),
      speciesId: species?.id ?? null,
      speciesKey: species?.key ?? null,
      property,
      identity,
    };
  }

  private push(item: Omit<DiffItem, 'entry'>): void {
    this.diff.push({ entry: this.index, ...item });
  }

  // ——— Entries ———

  private plan(entry: AmendmentEntry): void {
    switch (entry.kind) {
      case 'revise-value':
        return this.reviseValue(entry);
      case 'team-value':
        return this.teamValue(entry);
      case 'set-species':
        return this.setSpecies(entry);
      case 'set-model':
        return this.setModel(entry);
      case 'add-reaction':
        return this.addReaction(entry);
      case 'select-value':
        return this.selectValue(entry);
      case 'set-source':
        return this.setSource(entry);
      case 'mark-checked':
        return this.markChecked(entry);
      case 'deprecate':
        return this.deprecate(entry);
    }
  }

  /** The stated uncertainty of an entry, checked against the standard uncertainty it gives. */
  private stated(
    given: { value: number; uncertainty: number | null },
    stated: { kind: UncertaintyKind; value: number | null; k?: number | null | undefined } | undefined,
    field: string,
  ): { kind: UncertaintyKind; value: string | null; k: number | null } | null {
    const s = stated ?? {
      kind: given.uncertainty === null ? ('none' as const) : ('standard' as const),
      value: given.uncertainty,
      k: null,
    };
    if ((s.kind === 'none') !== (s.value === null)) {
      this.problem(
        ['stated', 'value'],
        `uncertainty kind ${s.kind} ${s.kind === 'none' ? 'takes no' : 'needs a'} value.`,
      );
      return null;
    }
    if ((s.kind === 'expanded') !== (s.k !== null && s.k !== undefined)) {
      this.problem(['stated', 'k'], 'a coverage factor k goes with an expanded uncertainty, and only with one.');
      return null;
    }
    let u: number | null;
    try {
      u = standardUncertainty(
        s.kind === 'none'
          ? { kind: 'none' }
          : s.kind === 'expanded'
            ? { kind: 'expanded', value: s.value!, k: s.k! }
            : { kind: s.kind, value: s.value! },
      ).u;
    } catch (error) {
      if (!(error instanceof ThermoInputError)) throw error;
      this.problem(['stated'], error.message);
      return null;
    }
    const agrees =
      u === null
        ? given.uncertainty === null
        : given.uncertainty !== null && Math.abs(u - given.uncertainty) <= 1e-9 * Math.max(1, Math.abs(u));
    if (!agrees) {
      this.problem(
        [field, 'uncertainty'],
        `is the standard uncertainty: with the stated ${s.kind} uncertainty ${s.value ?? 'none'} it is ${u ?? 'null'}.`,
      );
      return null;
    }
    return { kind: s.kind, value: s.value === null ? null : numberText(s.value), k: s.k ?? null };
  }

  private valueText(value: number, text: string | undefined): string | null {
    if (text === undefined) return numberText(value);
    if (Math.abs(Number(text) - value) > 1e-12 * Math.max(1, Math.abs(value))) {
      this.problem(['valueText'], `${text} is not the value ${value}.`);
      return null;
    }
    return text;
  }

  private addValue(
    species: SpeciesRef,
    property: LibraryProperty,
    source: SourceRef,
    record: ValueRecord,
    selection: { select: boolean; reason: string },
    kind: DiffItem['kind'],
  ): void {
    const identity = identities.value(species.key, property, source.key);
    const current = this.currentValue(species, property, source.key);
    const u = standardUncertainty(
      record.uncertaintyKind === 'none' || record.uncertainty === null
        ? { kind: 'none' }
        : record.uncertaintyKind === 'expanded'
          ? { kind: 'expanded', value: Number(record.uncertainty), k: record.k ?? Number.NaN }
          : { kind: record.uncertaintyKind, value: Number(record.uncertainty) },
    ).u;
    const next = side({
      value: Number(record.value),
      valueText: record.value,
      uncertainty: u,
      unit: propertyUnits[property],
      source: this.sourceSide(source.key),
      provenance: record.provenance,
    });
    const unchanged =
      current !== null &&
      Number(current.valueText) === Number(record.value) &&
      current.uncertaintyKind === record.uncertaintyKind &&
      (current.uncertaintyStated ?? null) === (record.uncertainty === null ? null : Number(record.uncertainty)) &&
      (current.coverageK ?? null) === (record.k ?? null) &&
      current.provenance === record.provenance &&
      (current.provenanceNote ?? null) === (record.note ?? null) &&
      (current.tableRef ?? null) === (record.table ?? null) &&
      (current.entryNote ?? null) === (record.entryNote ?? null) &&
      current.pressureBar === record.pressureBar &&
      (current.ionConvention ?? null) === (record.ionConvention ?? null) &&
      JSON.stringify(current.derivation ?? null) === JSON.stringify(record.derivation ?? null);
    this.set.values.push(record);
    this.addedValues.set(identity, next);
    this.deprecatedRows.delete(identity);
    this.targets.add(identity);
    const selectionChange = selection.select
      ? this.select(species, property, source.key, identity, selection.reason, next)
      : null;
    this.entrySpecies[this.index] = { key: species.key, id: species.id };
    this.push({
      kind,
      target: this.target('value', identity, species, property),
      action: current ? (unchanged && !selectionChange ? 'unchanged' : 'revise') : 'add',
      old: current ? this.valueSide(current) : null,
      new: next,
      selection: selectionChange,
    });
  }

  private reviseValue(e: Extract<AmendmentEntry, { kind: 'revise-value' }>): void {
    const species = this.species(e.species, ['species']);
    const source = this.source(e.source, ['source']);
    if (!species || !source) return;
    const property: LibraryProperty = e.deltaFH ? 'dfH298' : 'S298';
    const field = e.deltaFH ? 'deltaFH' : 'entropy';
    const given = (e.deltaFH ?? e.entropy)!;
    if (property === 'dfH298' && species.referenceState && given.value !== 0) {
      this.problem(
        [field, 'value'],
        `${species.key} is the reference state of ${species.referenceState}: its ΔfH° is 0 by definition.`,
      );
      return;
    }
    if (e.derivation && e.provenance !== 'derived') {
      this.problem(['derivation'], 'a derivation goes with provenance derived, and only with it.');
      return;
    }
    const stated = this.stated(given, e.stated, field);
    const text = this.valueText(given.value, e.valueText);
    if (!stated || text === null) return;
    const current = this.currentValue(species, property, source.key);
    const record: ValueRecord = {
      origin: this.origin,
      species: species.key,
      property,
      value: text,
      uncertaintyKind: stated.kind,
      uncertainty: stated.value,
      k: stated.k,
      source: source.key,
      table: e.table !== undefined ? e.table : (current?.tableRef ?? null),
      entryNote: e.entryNote !== undefined ? e.entryNote : (current?.entryNote ?? null),
      provenance: e.provenance ?? 'entered',
      pressureBar: e.pressureBar ?? current?.pressureBar ?? 1,
      ionConvention: e.ionConvention !== undefined ? e.ionConvention : (current?.ionConvention ?? null),
      note: e.provenanceNote ?? null,
      derivation: e.derivation ?? null,
    };
    this.addValue(
      species,
      property,
      source,
      record,
      { select: e.select ?? true, reason: e.selectionReason ?? this.defaultReason() },
      'revise-value',
    );
  }

  private teamValue(e: Extract<AmendmentEntry, { kind: 'team-value' }>): void {
    const row = this.input.teamValues.get(e.derivedValueId);
    if (!row || row.teamId !== e.teamId) {
      this.problem(['derivedValueId'], 'there is no such derived value in that team (or you are not a member of it).');
      return;
    }
    const species = this.species(row.speciesKey, ['derivedValueId']);
    const source = e.source ? this.source(e.source, ['source']) : this.derivedSource();
    if (!species || !source) return;
    const stored = (
      row.derivation as { inputs?: { input: string; weight: string; label: string; uncertainty: number | null }[] }
    ).inputs;
    const weights = (stored ?? []).map((i) => ({
      // The derivation's own given reactions are not library inputs: named after the team value.
      input: i.input.startsWith('given:') ? `team-value:${row.id}:${i.input}` : i.input,
      weight: i.weight,
      label: i.label,
      uncertainty: i.uncertainty,
    }));
    const request = (row.derivation as { request?: unknown }).request ?? null;
    const record: ValueRecord = {
      origin: this.origin,
      species: species.key,
      property: 'dfH298',
      value: row.deltaH,
      uncertaintyKind: row.uncertainty === null ? 'none' : 'standard',
      uncertainty: row.uncertainty === null ? null : numberText(row.uncertainty),
      k: null,
      source: source.key,
      table: null,
      entryNote: null,
      provenance: 'derived',
      pressureBar: 1,
      ionConvention: null,
      note:
        e.note ??
        `Derived by Hess's law by ${row.teamName} in Thermoledger at library revision ${row.libraryRevision}.`,
      derivation: {
        kind: 'team-value',
        teamId: row.teamId,
        team: row.teamName,
        derivedValueId: row.id,
        libraryRevision: row.libraryRevision,
        request,
        weights,
      },
    };
    this.addValue(
      species,
      'dfH298',
      source,
      record,
      { select: e.select ?? true, reason: e.selectionReason ?? this.defaultReason() },
      'team-value',
    );
  }

  private setSpecies(e: Extract<AmendmentEntry, { kind: 'set-species' }>): void {
    let read: ReturnType<typeof readSpeciesKey>;
    try {
      read = readSpeciesKey(e.key);
    } catch (error) {
      this.problem(['key'], `${e.key} is not a species key: ${(error as Error).message}`);
      return;
    }
    if (e.cas && !casCheckDigitValid(e.cas)) return this.problem(['cas'], 'is not a valid CAS RN (check digit).');
    if (e.inchikey && !/^[A-Z]{14}-[A-Z]{10}-[A-Z]$/.test(e.inchikey))
      return this.problem(['inchikey'], 'is not an InChIKey (14-10-1 upper-case letters).');
    if (e.inchi && !e.inchi.startsWith('InChI=')) return this.problem(['inchi'], 'must start with InChI=.');
    const existing = this.deprecatedSpecies.has(e.key) ? undefined : this.snapshot.speciesByKey.get(e.key);
    const record = {
      origin: this.origin,
      key: e.key,
      formula: read.formula,
      hill: read.hill,
      charge: read.charge,
      phase: read.phase,
      descriptor: read.descriptor,
      name: e.name,
      synonyms: e.synonyms ?? existing?.synonyms ?? [],
      cas: e.cas !== undefined ? e.cas : (existing?.cas ?? null),
      inchikey: e.inchikey !== undefined ? e.inchikey : (existing?.inchikey ?? null),
      inchi: e.inchi !== undefined ? e.inchi : (existing?.inchi ?? null),
      referenceState: existing?.referenceState ?? null,
      molarMass: read.molarMass,
      note: e.note !== undefined ? e.note : (existing?.note ?? null),
    };
    this.set.species.push(record);
    const ref = { key: e.key, id: existing?.id ?? null, referenceState: record.referenceState };
    this.addedSpecies.set(e.key, ref);
    this.deprecatedSpecies.delete(e.key);
    const identity = identities.species(e.key);
    this.targets.add(identity);
    this.entrySpecies[this.index] = { key: e.key, id: ref.id };
    const describe = (s: { name: string; synonyms: string[]; cas: string | null }) =>
      [s.name, s.synonyms.length ? `(${s.synonyms.join(', ')})` : '', s.cas ? `CAS ${s.cas}` : '']
        .filter(Boolean)
        .join(' ');
    const unchanged =
      existing !== undefined &&
      existing.name === record.name &&
      JSON.stringify(existing.synonyms) === JSON.stringify(record.synonyms) &&
      existing.cas === record.cas &&
      existing.inchikey === record.inchikey &&
      existing.inchi === record.inchi &&
      existing.note === record.note;
    this.push({
      kind: 'set-species',
      target: this.target('species', identity, ref, null),
      action: existing ? (unchanged ? 'unchanged' : 'revise') : 'add',
      old: existing ? side({ text: describe(existing) }) : null,
      new: side({ text: describe(record) }),
      selection: null,
    });
  }

  private setModel(e: Extract<AmendmentEntry, { kind: 'set-model' }>): void {
    const species = this.species(e.species, ['species']);
    const source = this.source(e.source, ['source']);
    if (!species || !source) return;
    const issues = thermoModelIssues({ species: species.key, scale: e.scale, forms: e.forms });
    if (issues.length > 0) {
      for (const issue of issues) this.problem(['forms', ...issue.path], issue.message);
      return;
    }
    const current = this.currentModel(species, source.key);
    const record: ModelRecord = {
      origin: this.origin,
      species: species.key,
      source: source.key,
      entryNote: e.entryNote !== undefined ? e.entryNote : (current?.entryNote ?? null),
      provenance: e.provenance ?? 'entered',
      provenanceNote: e.provenanceNote ?? null,
      scale: e.scale,
      forms: e.forms,
    };
    const identity = identities.model(species.key, source.key);
    const next = side({
      source: this.sourceSide(source.key),
      provenance: record.provenance,
      text: modelText(record, species.key),
    });
    this.set.models.push(record);
    this.addedModels.set(identity, next);
    this.deprecatedRows.delete(identity);
    this.targets.add(identity);
    const selection =
      (e.select ?? true)
        ? this.select(species, 'cp', source.key, identity, e.selectionReason ?? this.defaultReason(), next)
        : null;
    const unchanged =
      current !== null &&
      JSON.stringify(current.forms) === JSON.stringify(record.forms) &&
      current.scale === record.scale &&
      current.provenance === record.provenance &&
      (current.provenanceNote ?? null) === record.provenanceNote &&
      (current.entryNote ?? null) === record.entryNote;
    this.entrySpecies[this.index] = { key: species.key, id: species.id };
    this.push({
      kind: 'set-model',
      target: this.target('model', identity, species, 'cp'),
      action: current ? (unchanged && !selection ? 'unchanged' : 'revise') : 'add',
      old: current ? this.modelSide(current, species.key) : null,
      new: next,
      selection,
    });
  }

  /** The problems of toReaction, re-addressed to the entry's own fields. */
  private reactionProblems(problems: SetProblem[]): void {
    const fields: Record<string, (string | number)[]> = {
      equation: ['equation'],
      delta_h: ['deltaH', 'value'],
      uncertainty: ['stated'],
      k: ['stated', 'k'],
      molality: ['molality'],
      temperature: ['temperature'],
    };
    for (const p of problems) this.problem(fields[p.column ?? ''] ?? [], p.message);
  }

  private addReaction(e: Extract<AmendmentEntry, { kind: 'add-reaction' }>): void {
    const source = this.source(e.source, ['source']);
    const stated = this.stated(e.deltaH, e.stated, 'deltaH');
    const text = this.valueText(e.deltaH.value, e.valueText);
    if (!source || !stated || text === null) return;
    const key = e.key ?? reactionKey(e.equation);
    const problems: SetProblem[] = [];
    const record = toReaction(
      {
        key,
        equation: e.equation,
        delta_h: text,
        unit: 'kJ/mol',
        uncertainty_kind: stated.kind,
        uncertainty: stated.value,
        k: stated.k,
        temperature: e.temperature ?? 298.15,
        method: e.method,
        molality: e.molality ?? null,
        source: source.key,
        table: e.table ?? null,
        independent: e.independent ?? true,
        provenance: e.provenance ?? 'entered',
        note: e.note ?? null,
      },
      this.origin,
      problems,
    );
    if (!record) return this.reactionProblems(problems);
    if (this.review) {
      for (const term of record.terms) {
        if (term.finiteMolality) continue;
        const known =
          this.addedSpecies.has(term.key) ||
          (this.snapshot.speciesByKey.has(term.key) && !this.deprecatedSpecies.has(term.key));
        if (!known) this.problem(['equation'], this.unknownSpeciesMessage(term.key));
      }
    }
    this.pushReaction(record, 'add-reaction', 'add');
  }

  private unknownSpeciesMessage(key: string): string {
    let hint = '';
    try {
      const parsed = parseFormula(key);
      const phase = parsed.phase === 's' ? 'cr' : parsed.phase;
      const same = (this.snapshot.speciesByHill.get(hillKey(parsed.hill, parsed.charge)) ?? []).filter(
        (s) => s.phase === phase,
      );
      if (same.length > 0) hint = ` The library writes it as ${same.map((s) => s.key).join(' or ')}.`;
    } catch {
      // An unreadable key gets no suggestion.
    }
    return `${key} is not a library species key ${this.at}: write every species as the library writes it.${hint}`;
  }

  private reactionSide(r: {
    equation: string;
    deltaH: number;
    deltaHText: string;
    uncertainty: number | null;
    temperature: number;
    provenance: ReactionRecord['provenance'];
    sourceKey: string;
  }): DiffSide {
    return side({
      value: r.deltaH,
      valueText: r.deltaHText,
      uncertainty: r.uncertainty,
      unit: 'kJ/mol',
      source: this.sourceSide(r.sourceKey),
      provenance: r.provenance,
      text: `${r.equation}${Math.abs(r.temperature - 298.15) > 0.005 ? ` at ${r.temperature} K` : ''}`,
    });
  }

  private currentReactionSide(r: ReactionEntry): DiffSide {
    return this.reactionSide({
      equation: r.equation,
      deltaH: r.deltaH,
      deltaHText: r.deltaHText,
      uncertainty: r.standardUncertainty,
      temperature: r.temperature,
      provenance: r.provenance,
      sourceKey: this.snapshot.sources.get(r.sourceId)?.key ?? '?',
    });
  }

  private pushReaction(record: ReactionRecord, kind: DiffItem['kind'], action: 'add' | 'check'): void {
    const current = this.deprecatedReactions.has(record.key)
      ? undefined
      : this.snapshot.reactions.find((r) => r.key === record.key);
    const u = standardUncertainty(
      record.uncertaintyKind === 'none' || record.uncertainty === null
        ? { kind: 'none' }
        : record.uncertaintyKind === 'expanded'
          ? { kind: 'expanded', value: Number(record.uncertainty), k: record.k ?? Number.NaN }
          : { kind: record.uncertaintyKind, value: Number(record.uncertainty) },
    ).u;
    this.set.reactions.push(record);
    const identity = identities.reaction(record.key);
    this.targets.add(identity);
    const next = this.reactionSide({
      equation: record.equation,
      deltaH: Number(record.deltaH),
      deltaHText: record.deltaH,
      uncertainty: u,
      temperature: record.temperature,
      provenance: record.provenance,
      sourceKey: record.source,
    });
    const unchanged =
      current !== undefined &&
      current.equation === record.equation &&
      Number(current.deltaHText) === Number(record.deltaH) &&
      current.uncertaintyKind === record.uncertaintyKind &&
      (current.uncertaintyStated ?? null) === (record.uncertainty === null ? null : Number(record.uncertainty)) &&
      current.temperature === record.temperature &&
      current.method === record.method &&
      (current.molality ?? null) === record.molality &&
      current.independent === record.independent &&
      current.provenance === record.provenance &&
      (current.provenanceNote ?? null) === record.note &&
      (current.tableRef ?? null) === record.table &&
      this.snapshot.sources.get(current.sourceId)?.key === record.source;
    this.push({
      kind,
      target: this.target('reaction', identity, null, null),
      action: unchanged ? 'unchanged' : action === 'check' ? 'check' : current ? 'revise' : 'add',
      old: current ? this.currentReactionSide(current) : null,
      new: next,
      selection: null,
    });
  }

  private selectValue(e: Extract<AmendmentEntry, { kind: 'select-value' }>): void {
    const species = this.species(e.species, ['species']);
    const source = this.source(e.source, ['source']);
    if (!species || !source) return;
    const identity =
      e.property === 'cp'
        ? identities.model(species.key, source.key)
        : identities.value(species.key, e.property, source.key);
    const target = this.sideOf(identity, species);
    if (!target) {
      this.problem(
        ['source'],
        `there is no ${identityLabel(identity)} ${this.at} (nor added earlier in this amendment) to select.`,
      );
      return;
    }
    const now = this.selectedIdentity(species, e.property);
    const from = this.sideOf(now, species);
    const change = this.select(species, e.property, source.key, identity, e.reason, target);
    this.entrySpecies[this.index] = { key: species.key, id: species.id };
    this.push({
      kind: 'select-value',
      target: this.target('selection', identities.selection(species.key, e.property), species, e.property),
      action: change ? 'select' : 'unchanged',
      old: from,
      new: target,
      selection: change,
    });
  }

  private setSource(e: Extract<AmendmentEntry, { kind: 'set-source' }>): void {
    const fields = e.source;
    let existing: SourceEntry | undefined;
    if (e.id) {
      existing = this.snapshot.sources.get(e.id);
      if (!existing || this.deprecatedSources.has(existing.key))
        return this.problem(['id'], `there is no source with id ${e.id} in the library ${this.at}.`);
      if (existing.key !== fields.key)
        return this.problem(['source', 'key'], `a source's key never changes: this one is ${existing.key}.`);
    } else if (this.sourceByKey.has(fields.key) && !this.deprecatedSources.has(fields.key)) {
      return this.problem(['source', 'key'], `source ${fields.key} exists: give its id to correct it.`);
    } else if (this.addedSources.has(fields.key)) {
      return this.problem(['source', 'key'], `source ${fields.key} is added earlier in this amendment.`);
    }
    const record: SourceRecord = {
      origin: this.origin,
      key: fields.key,
      kind: fields.kind,
      authors: fields.authors,
      title: fields.title,
      publication: fields.publication ?? null,
      year: fields.year ?? null,
      volume: fields.volume ?? null,
      pages: fields.pages ?? null,
      doi: fields.doi ?? null,
      isbn: fields.isbn ?? null,
      url: fields.url ?? null,
      note: fields.note ?? null,
    };
    this.set.sources.push(record);
    this.addedSources.set(record.key, record);
    this.deprecatedSources.delete(record.key);
    this.sources.set(record.key, {
      id: existing?.id ?? null,
      key: record.key,
      citation: citationOf(record),
      isNew: !existing,
    });
    const identity = identities.source(record.key);
    this.targets.add(identity);
    const unchanged =
      existing !== undefined &&
      sourceContentFields.every(
        (f) =>
          ((existing as unknown as Record<string, unknown>)[f] ?? null) ===
          ((record as unknown as Record<string, unknown>)[f] ?? null),
      );
    this.push({
      kind: 'set-source',
      target: this.target('source', identity, null, null),
      action: existing ? (unchanged ? 'unchanged' : 'revise') : 'add',
      old: existing ? side({ text: citationOf(existing), source: this.sourceSide(existing.key) }) : null,
      new: side({
        text: citationOf(record),
        source: { id: existing?.id ?? null, key: record.key, citation: citationOf(record) },
      }),
      selection: null,
    });
  }

  private values(): Map<string, ValueEntry> {
    this.valueById ??= new Map([...this.snapshot.values.values()].flat().map((v) => [v.id, v]));
    return this.valueById;
  }

  private models(): Map<string, ModelEntry> {
    this.modelById ??= new Map([...this.snapshot.models.values()].flat().map((m) => [m.id, m]));
    return this.modelById;
  }

  private speciesOfRow(speciesId: string): SpeciesRef | null {
    const entry = this.snapshot.species.get(speciesId);
    if (!entry || this.deprecatedSpecies.has(entry.key)) return null;
    return { key: entry.key, id: entry.id, referenceState: entry.referenceState };
  }

  /** A value of the library as a record (to revise its provenance, or to restore it). */
  private valueRecordOf(v: ValueEntry, species: SpeciesEntry | SpeciesRef, sourceKey: string): ValueRecord {
    return {
      origin: this.origin,
      species: species.key,
      property: v.property,
      value: v.valueText,
      uncertaintyKind: v.uncertaintyKind,
      uncertainty: v.uncertaintyStated === null ? null : numberText(v.uncertaintyStated),
      k: v.coverageK,
      source: sourceKey,
      table: v.tableRef,
      entryNote: v.entryNote,
      provenance: v.provenance,
      pressureBar: v.pressureBar,
      ionConvention: v.ionConvention,
      note: v.provenanceNote,
      derivation: v.derivation,
    };
  }

  private markChecked(e: Extract<AmendmentEntry, { kind: 'mark-checked' }>): void {
    const notFound = () =>
      this.problem(['id'], `there is no current ${e.target} with id ${e.id} in the library ${this.at}.`);
    if (e.target === 'value') {
      const v = this.values().get(e.id);
      const species = v && this.speciesOfRow(v.speciesId);
      const source = v && this.snapshot.sources.get(v.sourceId);
      if (!v || !species || !source || this.deprecatedRows.has(identities.value(species.key, v.property, source.key)))
        return notFound();
      const record = { ...this.valueRecordOf(v, species, source.key), provenance: 'checked' as const };
      if (e.note !== undefined) record.note = e.note;
      const identity = identities.value(species.key, v.property, source.key);
      const next = side({ ...this.valueSide(v), provenance: 'checked' });
      this.set.values.push(record);
      this.addedValues.set(identity, next);
      this.targets.add(identity);
      this.entrySpecies[this.index] = { key: species.key, id: species.id };
      this.push({
        kind: 'mark-checked',
        target: this.target('value', identity, species, v.property),
        action: v.provenance === 'checked' && e.note === undefined ? 'unchanged' : 'check',
        old: this.valueSide(v),
        new: next,
        selection: null,
      });
      return;
    }
    if (e.target === 'model') {
      const m = this.models().get(e.id);
      const species = m && this.speciesOfRow(m.speciesId);
      const source = m && this.snapshot.sources.get(m.sourceId);
      if (!m || !species || !source || this.deprecatedRows.has(identities.model(species.key, source.key)))
        return notFound();
      const record: ModelRecord = {
        origin: this.origin,
        species: species.key,
        source: source.key,
        entryNote: m.entryNote,
        provenance: 'checked',
        provenanceNote: e.note ?? m.provenanceNote,
        scale: m.scale,
        forms: m.forms,
      };
      const identity = identities.model(species.key, source.key);
      const next = side({ ...this.modelSide(m, species.key), provenance: 'checked' });
      this.set.models.push(record);
      this.addedModels.set(identity, next);
      this.targets.add(identity);
      this.entrySpecies[this.index] = { key: species.key, id: species.id };
      this.push({
        kind: 'mark-checked',
        target: this.target('model', identity, species, 'cp'),
        action: m.provenance === 'checked' && e.note === undefined ? 'unchanged' : 'check',
        old: this.modelSide(m, species.key),
        new: next,
        selection: null,
      });
      return;
    }
    const r = this.snapshot.reactions.find((x) => x.id === e.id);
    const source = r && this.snapshot.sources.get(r.sourceId);
    if (!r || !source || this.deprecatedReactions.has(r.key)) return notFound();
    this.pushReaction(
      { ...this.reactionRecordOf(r, source.key), provenance: 'checked', note: e.note ?? r.provenanceNote },
      'mark-checked',
      'check',
    );
  }

  private reactionRecordOf(r: ReactionEntry, sourceKey: string): ReactionRecord {
    return {
      origin: this.origin,
      key: r.key,
      equation: r.equation,
      terms: r.terms.map((t) => ({ key: t.key, coefficient: t.coefficient, finiteMolality: t.speciesId === null })),
      deltaH: r.deltaHText,
      uncertaintyKind: r.uncertaintyKind,
      uncertainty: r.uncertaintyStated === null ? null : numberText(r.uncertaintyStated),
      k: r.coverageK,
      temperature: r.temperature,
      method: r.method as ReactionRecord['method'],
      molality: r.molality,
      source: sourceKey,
      table: r.tableRef,
      independent: r.independent,
      provenance: r.provenance,
      note: r.provenanceNote,
    };
  }

  private deprecate(e: Extract<AmendmentEntry, { kind: 'deprecate' }>): void {
    const notFound = () =>
      this.problem(['id'], `there is no current ${e.target} with id ${e.id} in the library ${this.at}.`);
    const deprecation = (fields: Omit<NonNullable<LibrarySet['deprecations']>[number], 'origin'>) =>
      this.set.deprecations!.push({ origin: this.origin, ...fields });
    switch (e.target) {
      case 'species': {
        const species = this.speciesOfRow(e.id);
        if (!species) return notFound();
        if (species.referenceState)
          return this.problem(
            ['id'],
            `${species.key} is the reference state of ${species.referenceState}: it cannot leave the library.`,
          );
        if (this.review) {
          const users = this.snapshot.reactions
            .filter((r) => !this.deprecatedReactions.has(r.key) && r.terms.some((t) => t.speciesId === e.id))
            .map((r) => r.key);
          if (users.length > 0)
            this.problem(
              ['id'],
              `${species.key} is used by the measured reaction(s) ${users.join(', ')}: deprecate or correct them first (in an earlier entry).`,
            );
        }
        deprecation({ target: 'species', key: species.key });
        const identity = identities.species(species.key);
        this.targets.add(identity);
        for (const v of this.snapshot.values.get(e.id) ?? []) {
          const s = this.snapshot.sources.get(v.sourceId);
          if (s) this.targets.add(identities.value(species.key, v.property, s.key));
          this.targets.add(identities.selection(species.key, v.property));
        }
        for (const m of this.snapshot.models.get(e.id) ?? []) {
          const s = this.snapshot.sources.get(m.sourceId);
          if (s) this.targets.add(identities.model(species.key, s.key));
          this.targets.add(identities.selection(species.key, 'cp'));
        }
        this.deprecatedSpecies.add(species.key);
        this.addedSpecies.delete(species.key);
        this.entrySpecies[this.index] = { key: species.key, id: species.id };
        const entry = this.snapshot.species.get(e.id)!;
        this.push({
          kind: 'deprecate',
          target: this.target('species', identity, species, null),
          action: 'deprecate',
          old: side({ text: entry.name }),
          new: null,
          selection: null,
        });
        return;
      }
      case 'value':
      case 'model': {
        const row = e.target === 'value' ? this.values().get(e.id) : this.models().get(e.id);
        const species = row && this.speciesOfRow(row.speciesId);
        const source = row && this.snapshot.sources.get(row.sourceId);
        if (!row || !species || !source) return notFound();
        const property: SelectableProperty = e.target === 'value' ? (row as ValueEntry).property : 'cp';
        const identity =
          e.target === 'value'
            ? identities.value(species.key, property as LibraryProperty, source.key)
            : identities.model(species.key, source.key);
        if (this.deprecatedRows.has(identity)) return notFound();
        const oldSide =
          e.target === 'value' ? this.valueSide(row as ValueEntry) : this.modelSide(row as ModelEntry, species.key);
        const wasSelected = this.selectedIdentity(species, property) === identity;
        deprecation({
          target: e.target,
          key: species.key,
          source: source.key,
          ...(e.target === 'value' ? { property: property as LibraryProperty } : {}),
        });
        this.targets.add(identity);
        this.deprecatedRows.add(identity);
        this.addedValues.delete(identity);
        this.addedModels.delete(identity);
        if (wasSelected) {
          this.targets.add(identities.selection(species.key, property));
          this.selected.set(`${species.key}|${property}`, null);
          this.explicitlySelected.delete(`${species.key}|${property}`);
          this.reselect.set(`${species.key}|${property}`, this.index);
        }
        this.entrySpecies[this.index] = { key: species.key, id: species.id };
        this.push({
          kind: 'deprecate',
          target: this.target(e.target, identity, species, property),
          action: 'deprecate',
          old: oldSide,
          new: null,
          selection: null,
        });
        return;
      }
      case 'reaction': {
        const r = this.snapshot.reactions.find((x) => x.id === e.id);
        if (!r || this.deprecatedReactions.has(r.key)) return notFound();
        deprecation({ target: 'reaction', key: r.key });
        const identity = identities.reaction(r.key);
        this.targets.add(identity);
        this.deprecatedReactions.add(r.key);
        this.push({
          kind: 'deprecate',
          target: this.target('reaction', identity, null, null),
          action: 'deprecate',
          old: this.currentReactionSide(r),
          new: null,
          selection: null,
        });
        return;
      }
      case 'source': {
        const source = this.snapshot.sources.get(e.id);
        if (!source || this.deprecatedSources.has(source.key)) return notFound();
        if (this.review) {
          const cited =
            [...this.snapshot.values.values()]
              .flat()
              .filter((v) => v.sourceId === e.id && !this.deprecatedByRow(v.speciesId, v.property, source.key)).length +
            [...this.snapshot.models.values()]
              .flat()
              .filter((m) => m.sourceId === e.id && !this.deprecatedByRow(m.speciesId, 'cp', source.key)).length +
            this.snapshot.reactions.filter((r) => r.sourceId === e.id && !this.deprecatedReactions.has(r.key)).length;
          if (cited > 0)
            this.problem(
              ['id'],
              `source ${source.key} is cited by ${cited} current value(s), model(s) or reaction(s): deprecate or re-source them first.`,
            );
        }
        deprecation({ target: 'source', key: source.key });
        const identity = identities.source(source.key);
        this.targets.add(identity);
        this.deprecatedSources.add(source.key);
        this.push({
          kind: 'deprecate',
          target: this.target('source', identity, null, null),
          action: 'deprecate',
          old: side({
            text: citationOf(source),
            source: { id: source.id, key: source.key, citation: citationOf(source) },
          }),
          new: null,
          selection: null,
        });
        return;
      }
    }
  }

  private deprecatedByRow(speciesId: string, property: SelectableProperty, sourceKey: string): boolean {
    const species = this.snapshot.species.get(speciesId);
    if (!species) return true;
    if (this.deprecatedSpecies.has(species.key)) return true;
    const identity =
      property === 'cp' ? identities.model(species.key, sourceKey) : identities.value(species.key, property, sourceKey);
    return this.deprecatedRows.has(identity);
  }
}
