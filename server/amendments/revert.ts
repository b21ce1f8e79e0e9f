import type { AmendmentEntry } from '@shared/schemas/amendments';
import type { LibraryProperty } from '@shared/schemas/library-core';
import { parseIdentity, type Identity } from '../library/identities';
import type {
  LibrarySnapshot,
  ModelEntry,
  ReactionEntry,
  SourceEntry,
  SpeciesEntry,
  ValueEntry,
} from '../library/snapshot';

/**
 * The entries that undo a revision: for every identity it touched, the state of revision r − 1
 * restored — a revised row revised back, an added row deprecated, a deprecated row added again,
 * a changed selection selected back. Read from the two snapshots, so it needs no record of the
 * entries themselves. Ordered so each entry finds what it needs: sources, species, values and
 * models, reactions, selections, then deprecations (values, reactions, species, sources).
 */
export function inverseEntries(
  before: LibrarySnapshot,
  after: LibrarySnapshot,
  touched: readonly string[],
): AmendmentEntry[] {
  const parsed = touched.map(parseIdentity).filter((i): i is Identity => i !== null);
  const sourcesByKey = (s: LibrarySnapshot) => new Map([...s.sources.values()].map((x) => [x.key, x]));
  const beforeSources = sourcesByKey(before);
  const afterSources = sourcesByKey(after);
  const groups = {
    sources: [] as AmendmentEntry[],
    species: [] as AmendmentEntry[],
    rows: [] as AmendmentEntry[],
    reactions: [] as AmendmentEntry[],
    selections: [] as AmendmentEntry[],
    deprecateRows: [] as AmendmentEntry[],
    deprecateSpecies: [] as AmendmentEntry[],
    deprecateSources: [] as AmendmentEntry[],
  };
  // Species the revision added go away whole: their own rows need no entries of their own.
  const addedSpecies = new Set(
    parsed
      .filter((i) => i.type === 'species' && !before.speciesByKey.has(i.key) && after.speciesByKey.has(i.key))
      .map((i) => (i as { key: string }).key),
  );
  const speciesRef = (key: string) => after.speciesByKey.get(key)?.id ?? key;
  const reason = 'reverted';

  for (const identity of parsed) {
    switch (identity.type) {
      case 'source': {
        const b = beforeSources.get(identity.key);
        const a = afterSources.get(identity.key);
        if (b && (!a || !sameSource(a, b)))
          groups.sources.push({ kind: 'set-source', ...(a ? { id: a.id } : {}), source: sourceFields(b) });
        else if (!b && a) groups.deprecateSources.push({ kind: 'deprecate', target: 'source', id: a.id, reason });
        break;
      }
      case 'species': {
        const b = before.speciesByKey.get(identity.key);
        const a = after.speciesByKey.get(identity.key);
        if (b) groups.species.push(speciesEntry(b));
        else if (a) groups.deprecateSpecies.push({ kind: 'deprecate', target: 'species', id: a.id, reason });
        break;
      }
      case 'value': {
        if (addedSpecies.has(identity.species)) break;
        const b = valueOf(before, beforeSources, identity.species, identity.property, identity.source);
        const a = valueOf(after, afterSources, identity.species, identity.property, identity.source);
        if (b) groups.rows.push(valueEntry(b, speciesRef(identity.species), identity.source));
        else if (a) groups.deprecateRows.push({ kind: 'deprecate', target: 'value', id: a.id, reason });
        break;
      }
      case 'model': {
        if (addedSpecies.has(identity.species)) break;
        const b = modelOf(before, beforeSources, identity.species, identity.source);
        const a = modelOf(after, afterSources, identity.species, identity.source);
        if (b)
          groups.rows.push({
            kind: 'set-model',
            species: speciesRef(identity.species),
            source: { key: identity.source },
            scale: b.scale,
            forms: b.forms,
            entryNote: b.entryNote,
            provenance: b.provenance,
            provenanceNote: b.provenanceNote,
            select: false,
          });
        else if (a) groups.deprecateRows.push({ kind: 'deprecate', target: 'model', id: a.id, reason });
        break;
      }
      case 'selection': {
        if (addedSpecies.has(identity.species)) break;
        const b = before.speciesByKey.get(identity.species);
        const selection = b && before.selections.get(`${b.id}|${identity.property}`);
        if (!b || !selection) break;
        const row =
          identity.property === 'cp'
            ? before.models.get(b.id)?.find((m) => m.id === selection.valueId)
            : before.values.get(b.id)?.find((v) => v.id === selection.valueId);
        const source = row && before.sources.get(row.sourceId);
        if (!source) break;
        groups.selections.push({
          kind: 'select-value',
          species: speciesRef(identity.species),
          property: identity.property,
          source: { key: source.key },
          reason: selection.reason,
        });
        break;
      }
      case 'reaction': {
        const b = before.reactions.find((r) => r.key === identity.key);
        const a = after.reactions.find((r) => r.key === identity.key);
        if (b) groups.reactions.push(reactionEntry(b, before.sources.get(b.sourceId)!.key));
        else if (a) groups.deprecateRows.push({ kind: 'deprecate', target: 'reaction', id: a.id, reason });
        break;
      }
    }
  }
  return [
    ...groups.sources,
    ...groups.species,
    ...groups.rows,
    ...groups.reactions,
    ...groups.selections,
    ...groups.deprecateRows,
    ...groups.deprecateSpecies,
    ...groups.deprecateSources,
  ];
}

function sourceFields(s: SourceEntry) {
  return {
    key: s.key,
    kind: s.kind,
    authors: s.authors,
    title: s.title,
    publication: s.publication,
    year: s.year,
    volume: s.volume,
    pages: s.pages,
    doi: s.doi,
    isbn: s.isbn,
    url: s.url,
    note: s.note,
  };
}

function sameSource(a: SourceEntry, b: SourceEntry): boolean {
  return JSON.stringify(sourceFields(a)) === JSON.stringify(sourceFields(b));
}

function speciesEntry(s: SpeciesEntry): AmendmentEntry {
  return {
    kind: 'set-species',
    key: s.key,
    name: s.name,
    synonyms: s.synonyms,
    cas: s.cas,
    inchikey: s.inchikey,
    inchi: s.inchi,
    note: s.note,
  };
}

function valueOf(
  snapshot: LibrarySnapshot,
  sources: Map<string, SourceEntry>,
  speciesKey: string,
  property: LibraryProperty,
  sourceKey: string,
): ValueEntry | undefined {
  const species = snapshot.speciesByKey.get(speciesKey);
  const source = sources.get(sourceKey);
  if (!species || !source) return undefined;
  return snapshot.values.get(species.id)?.find((v) => v.property === property && v.sourceId === source.id);
}

function modelOf(
  snapshot: LibrarySnapshot,
  sources: Map<string, SourceEntry>,
  speciesKey: string,
  sourceKey: string,
): ModelEntry | undefined {
  const species = snapshot.speciesByKey.get(speciesKey);
  const source = sources.get(sourceKey);
  if (!species || !source) return undefined;
  return snapshot.models.get(species.id)?.find((m) => m.sourceId === source.id);
}

function valueEntry(v: ValueEntry, species: string, sourceKey: string): AmendmentEntry {
  const amount = { value: Number(v.valueText), uncertainty: v.standardUncertainty };
  return {
    kind: 'revise-value',
    species,
    ...(v.property === 'dfH298' ? { deltaFH: amount } : { entropy: amount }),
    valueText: v.valueText,
    stated: { kind: v.uncertaintyKind, value: v.uncertaintyStated, k: v.coverageK },
    source: { key: sourceKey },
    table: v.tableRef,
    entryNote: v.entryNote,
    provenance: v.provenance,
    provenanceNote: v.provenanceNote,
    pressureBar: v.pressureBar === 1.01325 ? 1.01325 : 1,
    ionConvention: v.ionConvention === 'ion' || v.ionConvention === 'thermal-electron' ? v.ionConvention : null,
    ...(v.derivation && v.provenance === 'derived' ? { derivation: v.derivation } : {}),
    select: false,
  };
}

function reactionEntry(r: ReactionEntry, sourceKey: string): AmendmentEntry {
  return {
    kind: 'add-reaction',
    key: r.key,
    equation: r.equation,
    deltaH: { value: Number(r.deltaHText), uncertainty: r.standardUncertainty },
    valueText: r.deltaHText,
    stated: { kind: r.uncertaintyKind, value: r.uncertaintyStated, k: r.coverageK },
    temperature: r.temperature,
    method: r.method as Extract<AmendmentEntry, { kind: 'add-reaction' }>['method'],
    molality: r.molality,
    independent: r.independent,
    source: { key: sourceKey },
    table: r.tableRef,
    provenance: r.provenance,
    note: r.provenanceNote,
  };
}
