import { propertyUnits, type Provenance } from '@shared/schemas/library-core';
import type { LibraryModel, LibraryValue, Source, SourceRef, SpeciesSummary } from '@shared/schemas/library';
import { statedRange } from './seed-set';
import {
  selectedModel,
  selectedValue,
  type LibrarySnapshot,
  type ModelEntry,
  type SourceEntry,
  type SpeciesEntry,
  type ValueEntry,
} from './snapshot';

/**
 * Snapshot entries → API shapes (shared/schemas/library.ts). The one place that decides how a
 * library record looks on the wire.
 */

/** "McBride, Gordon & Reno, NASA Technical Memorandum 4513 (1993)". */
export function citationOf(source: Pick<SourceEntry, 'authors' | 'title' | 'publication' | 'year'>): string {
  const families = source.authors
    .split(';')
    .map((a) => a.split(',')[0]!.trim())
    .filter(Boolean);
  const who =
    families.length === 0
      ? ''
      : families.length <= 3
        ? families.length === 1
          ? families[0]!
          : `${families.slice(0, -1).join(', ')} & ${families[families.length - 1]}`
        : `${families[0]} et al.`;
  const where = source.publication ?? source.title;
  return `${who}${who ? ', ' : ''}${where}${source.year ? ` (${source.year})` : ''}`;
}

export function sourceRef(source: SourceEntry): SourceRef {
  return { id: source.id, key: source.key, citation: citationOf(source) };
}

export function presentSource(source: SourceEntry): Source {
  return { ...source, citation: citationOf(source) };
}

/** The source of an entry, which the library guarantees exists at the same revision. */
export function sourceOf(snapshot: LibrarySnapshot, sourceId: string): SourceEntry {
  const source = snapshot.sources.get(sourceId);
  if (!source) throw new Error(`library revision ${snapshot.revision}: missing source ${sourceId}`);
  return source;
}

export function summarize(snapshot: LibrarySnapshot, species: SpeciesEntry): SpeciesSummary {
  const dfH = selectedValue(snapshot, species.id, 'dfH298');
  const model = selectedModel(snapshot, species.id);
  const values = snapshot.values.get(species.id) ?? [];
  const models = snapshot.models.get(species.id) ?? [];
  const sourceKeys = new Set<string>();
  for (const item of [...values, ...models]) sourceKeys.add(sourceOf(snapshot, item.sourceId).key);
  const provenances = new Set<Provenance>([...values, ...models].map((v) => v.provenance));
  return {
    id: species.id,
    key: species.key,
    formula: species.formula,
    hill: species.hill,
    charge: species.charge,
    phase: species.phase,
    descriptor: species.descriptor,
    name: species.name,
    synonyms: species.synonyms,
    cas: species.cas,
    inchikey: species.inchikey,
    referenceState: species.referenceState,
    molarMass: species.molarMass,
    deltaFH: dfH
      ? {
          value: dfH.value,
          uncertainty: dfH.standardUncertainty,
          provenance: dfH.provenance,
          source: sourceOf(snapshot, dfH.sourceId).key,
        }
      : null,
    modelRange: model ? [model.tMin, model.tMax] : null,
    sources: [...sourceKeys].sort(),
    provenances: [...provenances].sort(),
  };
}

export function presentValue(snapshot: LibrarySnapshot, value: ValueEntry): LibraryValue {
  const selection = snapshot.selections.get(`${value.speciesId}|${value.property}`);
  const selected = selection?.valueId === value.id;
  return {
    id: value.id,
    property: value.property,
    value: value.value,
    valueText: value.valueText,
    unit: propertyUnits[value.property],
    stated: { kind: value.uncertaintyKind, value: value.uncertaintyStated, k: value.coverageK },
    uncertainty: value.standardUncertainty,
    uncertaintyRule: value.uncertaintyRule,
    source: sourceRef(sourceOf(snapshot, value.sourceId)),
    table: value.tableRef,
    entryNote: value.entryNote,
    provenance: value.provenance,
    provenanceNote: value.provenanceNote,
    pressureBar: value.pressureBar,
    ionConvention: value.ionConvention,
    derivation: value.derivation,
    selected,
    selectionReason: selected ? selection.reason : null,
    sinceRevision: value.validFrom,
  };
}

export function presentModel(
  snapshot: LibrarySnapshot,
  model: ModelEntry,
  transitions: LibraryModel['transitions'],
): LibraryModel {
  const selection = snapshot.selections.get(`${model.speciesId}|cp`);
  return {
    id: model.id,
    source: sourceRef(sourceOf(snapshot, model.sourceId)),
    scale: model.scale,
    forms: model.forms,
    range: statedRange({ species: model.speciesId, scale: model.scale, forms: model.forms }),
    entryNote: model.entryNote,
    provenance: model.provenance,
    provenanceNote: model.provenanceNote,
    selected: selection?.valueId === model.id,
    transitions,
    sinceRevision: model.validFrom,
  };
}
