/**
 * The new-amendment page's entry forms turned into amendment entries (shared/schemas/amendments.ts),
 * checked with the shared zod schema of each kind so a message names the form's own field; and
 * words for the entries listed so far. Pure: no Vue, no naive-ui.
 */
import type { z } from 'zod';
import {
  addReactionEntrySchema,
  citedSourceSchema,
  deprecateEntrySchema,
  reviseValueEntrySchema,
  selectValueEntrySchema,
  setSourceEntrySchema,
  setSpeciesEntrySchema,
  type AmendmentEntry,
  type SourceInput,
} from '@shared/schemas/amendments';
import type { ReactionMethod, SourceKind } from '@shared/schemas/library-core';
import { validateForm } from './validate-form';

/** The kinds the page offers, in the order of its chooser ("entropy" is revise-value with S°). */
export const entryFormKinds = [
  'revise-value',
  'entropy',
  'set-species',
  'set-source',
  'select-value',
  'add-reaction',
  'deprecate',
] as const;
export type EntryFormKind = (typeof entryFormKinds)[number];

export const entryFormLabels: Record<EntryFormKind, string> = {
  'revise-value': 'New or revised ΔfH°',
  entropy: 'New or revised S°',
  'set-species': 'New species',
  'set-source': 'New or corrected source',
  'select-value': 'Change of the selected value',
  'add-reaction': 'Measured reaction',
  deprecate: 'Deprecation',
};

export type EntryCheck<E> = { ok: true; entry: E } | { ok: false; errors: Record<string, string> };

/** Runs the kind's schema on `entry`; messages go to the form field `fieldOf` names (first message wins). */
function check<E>(schema: z.ZodType<E>, entry: unknown, fieldOf: (path: string) => string): EntryCheck<E> {
  const result = validateForm(schema, entry);
  if (result.ok) return { ok: true, entry: result.data };
  const errors: Record<string, string> = {};
  for (const [path, message] of Object.entries(result.errors)) errors[fieldOf(path)] ??= message;
  return { ok: false, errors };
}

const firstSegment = (path: string) => path.split('.')[0] || 'form';
const blank = (s: string) => s.trim() === '';
const optionalText = (s: string) => (blank(s) ? undefined : s.trim());

// ——— Sources ———

/** A source as the forms choose it: a key (the library's, or one a set-source entry adds) or a citation. */
export interface SourceChoice {
  mode: 'key' | 'citation';
  key: string | null;
  citation: string;
}

export const emptySourceChoice = (): SourceChoice => ({ mode: 'key', key: null, citation: '' });

/** What is missing from a source choice, in words (the schema's union would only say "Invalid input"). */
export function sourceProblem(choice: SourceChoice): string | null {
  if (choice.mode === 'key') return choice.key ? null : 'Pick a source.';
  const parsed = citedSourceSchema.safeParse({ citation: choice.citation });
  return parsed.success ? null : (parsed.error.issues[0]?.message ?? 'Write the citation.');
}

/** Puts the source's own message in place of the union's generic one. */
function withSource<E>(result: EntryCheck<E>, choice: SourceChoice): EntryCheck<E> {
  const problem = sourceProblem(choice);
  if (problem === null) return result;
  return { ok: false, errors: { ...(result.ok ? {} : result.errors), source: problem } };
}

/** The entry's `source` (an empty key stays empty, so the schema names the field). */
export function sourceInputOf(choice: SourceChoice): SourceInput {
  return choice.mode === 'key' ? ({ key: choice.key ?? '' } as SourceInput) : { citation: choice.citation };
}

// ——— revise-value (ΔfH° or S°) ———

export interface ValueEntryForm {
  /** Species key ("CO2(g)") or id. */
  species: string;
  /** kJ/mol for ΔfH°, J/(mol K) for S°. */
  value: number | null;
  /** Standard uncertainty (k = 1); null when the source states none. */
  uncertainty: number | null;
  source: SourceChoice;
  /** Make it the selected value. */
  select: boolean;
}

export function valueEntry(property: 'dfH298' | 'S298', form: ValueEntryForm): EntryCheck<AmendmentEntry> {
  const figure = { value: form.value as number, uncertainty: form.uncertainty };
  const entry = {
    kind: 'revise-value',
    species: form.species,
    ...(property === 'dfH298' ? { deltaFH: figure } : { entropy: figure }),
    source: sourceInputOf(form.source),
    select: form.select,
  };
  const result = check(reviseValueEntrySchema, entry, (path) =>
    /^(deltaFH|entropy)(\.value)?$/.test(path)
      ? 'value'
      : /\.uncertainty$/.test(path)
        ? 'uncertainty'
        : firstSegment(path),
  );
  return withSource(result, form.source);
}

// ——— set-species ———

export interface SpeciesEntryForm {
  key: string;
  name: string;
  /** Separated by ";". */
  synonyms: string;
  cas: string;
  inchikey: string;
  note: string;
}

export const emptySpeciesForm = (): SpeciesEntryForm => ({
  key: '',
  name: '',
  synonyms: '',
  cas: '',
  inchikey: '',
  note: '',
});

export function speciesEntry(form: SpeciesEntryForm): EntryCheck<AmendmentEntry> {
  const synonyms = form.synonyms
    .split(';')
    .map((s) => s.trim())
    .filter((s) => s !== '');
  const entry = {
    kind: 'set-species',
    key: form.key,
    name: form.name,
    ...(synonyms.length > 0 ? { synonyms } : {}),
    ...(blank(form.cas) ? {} : { cas: form.cas.trim() }),
    ...(blank(form.inchikey) ? {} : { inchikey: form.inchikey.trim() }),
    ...(blank(form.note) ? {} : { note: form.note.trim() }),
  };
  return check(setSpeciesEntrySchema, entry, firstSegment);
}

// ——— set-source ———

export interface SourceEntryForm {
  /** The library source corrected, or null for a new one. */
  id: string | null;
  key: string;
  kind: SourceKind | null;
  authors: string;
  title: string;
  publication: string;
  year: number | null;
  volume: string;
  pages: string;
  doi: string;
  url: string;
}

export const emptySourceForm = (): SourceEntryForm => ({
  id: null,
  key: '',
  kind: null,
  authors: '',
  title: '',
  publication: '',
  year: null,
  volume: '',
  pages: '',
  doi: '',
  url: '',
});

export function sourceEntry(form: SourceEntryForm): EntryCheck<AmendmentEntry> {
  const entry = {
    kind: 'set-source',
    ...(form.id ? { id: form.id } : {}),
    source: {
      key: form.key,
      kind: form.kind ?? undefined,
      authors: form.authors,
      title: form.title,
      publication: optionalText(form.publication) ?? null,
      year: form.year,
      volume: optionalText(form.volume) ?? null,
      pages: optionalText(form.pages) ?? null,
      doi: optionalText(form.doi) ?? null,
      url: optionalText(form.url) ?? null,
    },
  };
  return check(setSourceEntrySchema, entry, (path) =>
    path.startsWith('source.') ? path.slice(7) : firstSegment(path),
  );
}

// ——— select-value ———

export interface SelectionEntryForm {
  species: string;
  property: 'dfH298' | 'S298' | 'cp';
  /** Key of the source whose value (or model) becomes the selected one. */
  sourceKey: string | null;
  reason: string;
}

export function selectionEntry(form: SelectionEntryForm): EntryCheck<AmendmentEntry> {
  const entry = {
    kind: 'select-value',
    species: form.species,
    property: form.property,
    source: { key: form.sourceKey ?? '' },
    reason: form.reason,
  };
  const result = check(selectValueEntrySchema, entry, firstSegment);
  return form.sourceKey
    ? result
    : { ok: false, errors: { ...(result.ok ? {} : result.errors), source: 'Pick the value to select.' } };
}

// ——— add-reaction ———

export interface ReactionEntryForm {
  equation: string;
  /** ΔrH per mole of reaction as written, kJ/mol. */
  value: number | null;
  uncertainty: number | null;
  /** K; null means 298.15 K. */
  temperature: number | null;
  method: ReactionMethod | null;
  source: SourceChoice;
  note: string;
}

export const emptyReactionForm = (): ReactionEntryForm => ({
  equation: '',
  value: null,
  uncertainty: null,
  temperature: 298.15,
  method: null,
  source: emptySourceChoice(),
  note: '',
});

export function reactionEntry(form: ReactionEntryForm): EntryCheck<AmendmentEntry> {
  const entry = {
    kind: 'add-reaction',
    equation: form.equation,
    deltaH: { value: form.value as number, uncertainty: form.uncertainty },
    ...(form.temperature === null ? {} : { temperature: form.temperature }),
    method: form.method ?? undefined,
    source: sourceInputOf(form.source),
    ...(blank(form.note) ? {} : { note: form.note.trim() }),
  };
  const result = check(addReactionEntrySchema, entry, (path) =>
    path === 'deltaH' || path === 'deltaH.value'
      ? 'value'
      : path === 'deltaH.uncertainty'
        ? 'uncertainty'
        : firstSegment(path),
  );
  return withSource(result, form.source);
}

// ——— deprecate ———

export type DeprecateTarget = 'species' | 'value' | 'model' | 'source';

export interface DeprecationEntryForm {
  target: DeprecateTarget;
  /** The row's id (species, value, model or source). */
  id: string | null;
  reason: string;
}

export function deprecationEntry(form: DeprecationEntryForm): EntryCheck<AmendmentEntry> {
  const entry = { kind: 'deprecate', target: form.target, id: form.id ?? '', reason: form.reason };
  const result = check(deprecateEntrySchema, entry, firstSegment);
  return form.id
    ? result
    : { ok: false, errors: { ...(result.ok ? {} : result.errors), id: `Pick the ${form.target}.` } };
}

// ——— The list of entries ———

const minus = (x: number) => (x < 0 ? `−${Math.abs(x)}` : String(x));
const figure = (v: { value: number; uncertainty: number | null }, unit: string) =>
  `${minus(v.value)}${v.uncertainty === null ? '' : ` ± ${v.uncertainty}`} ${unit}`;

function sourceWords(source: SourceInput | undefined): string {
  if (source === undefined) return '';
  if (typeof source === 'string') return 'a library source';
  return 'citation' in source ? `“${source.citation}”` : source.key;
}

/**
 * One line for an entry in the list. `names` gives words for ids (species, values, models,
 * sources picked in a form) where the entry holds only the id.
 */
export function entryLine(entry: AmendmentEntry, names: ReadonlyMap<string, string> = new Map()): string {
  const name = (id: string) => names.get(id) ?? id;
  switch (entry.kind) {
    case 'revise-value':
      return entry.deltaFH
        ? `ΔfH° of ${name(entry.species)}: ${figure(entry.deltaFH, 'kJ/mol')}, from ${sourceWords(entry.source)}`
        : `S° of ${name(entry.species)}: ${figure(entry.entropy!, 'J/(mol K)')}, from ${sourceWords(entry.source)}`;
    case 'set-species':
      return `Species ${entry.key} (${entry.name})`;
    case 'set-source':
      return `${entry.id ? 'Corrected' : 'New'} source ${entry.source.key}: ${entry.source.authors}, ${entry.source.title}`;
    case 'select-value': {
      const what = { dfH298: 'ΔfH°', S298: 'S°', cp: 'heat-capacity model' }[entry.property];
      return `Select the ${what} of ${name(entry.species)} from ${sourceWords(entry.source)}`;
    }
    case 'add-reaction':
      return `Reaction ${entry.equation}: ΔrH = ${figure(entry.deltaH, 'kJ/mol')} at ${entry.temperature ?? 298.15} K, from ${sourceWords(entry.source)}`;
    case 'deprecate':
      return `Deprecate the ${entry.target} ${name(entry.id)}: ${entry.reason}`;
    case 'team-value':
      return `A team's derived value (${entry.derivedValueId})`;
    case 'set-model':
      return `Heat-capacity model of ${name(entry.species)} from ${sourceWords(entry.source)}`;
    case 'mark-checked':
      return `Mark the ${entry.target} ${name(entry.id)} as checked`;
  }
}

/** Source keys that set-source entries of the amendment add: later entries may cite them. */
export function addedSourceKeys(entries: readonly AmendmentEntry[]): string[] {
  return entries.flatMap((e) => (e.kind === 'set-source' && !e.id ? [e.source.key] : []));
}

/** Species keys that set-species entries of the amendment add: later entries may name them. */
export function addedSpeciesKeys(entries: readonly AmendmentEntry[]): string[] {
  return entries.flatMap((e) => (e.kind === 'set-species' ? [e.key] : []));
}

/**
 * The server's per-field messages (from a 400: "entries.2.deltaFH.value") grouped by entry index;
 * messages not about an entry (title, rationale) are left out.
 */
export function entryMessages(errors: Readonly<Record<string, string>>): Map<number, string[]> {
  const out = new Map<number, string[]>();
  for (const [path, message] of Object.entries(errors)) {
    const match = /^entries\.(\d+)(?:\.(.+))?$/.exec(path);
    if (!match) continue;
    const index = Number(match[1]);
    const list = out.get(index) ?? [];
    list.push(match[2] ? `${match[2]}: ${message}` : message);
    out.set(index, list);
  }
  return out;
}
