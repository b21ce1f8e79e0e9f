import Papa from 'papaparse';
import type { LibraryExport } from '@shared/schemas/library-io';
import type { LibrarySnapshot } from '../library/snapshot';

/**
 * The library at one revision as the JSON export (re-importable) and as a CSV of its values in
 * the values-*.csv format of seeds/library/FORMAT.md, with a `selected` column.
 */

const byCodeUnits = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

export function libraryExport(snapshot: LibrarySnapshot): LibraryExport {
  const sourceKey = (id: string) => snapshot.sources.get(id)!.key;
  const speciesKey = (id: string) => snapshot.species.get(id)!.key;
  const sources = [...snapshot.sources.values()]
    .map((s) => ({
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
    }))
    .sort((a, b) => byCodeUnits(a.key, b.key));
  const species = [...snapshot.species.values()]
    .map((s) => ({
      key: s.key,
      name: s.name,
      synonyms: s.synonyms,
      cas: s.cas,
      inchikey: s.inchikey,
      inchi: s.inchi,
      referenceState: s.referenceState,
      note: s.note,
    }))
    .sort((a, b) => byCodeUnits(a.key, b.key));
  const values = [...snapshot.values.values()]
    .flat()
    .map((v) => ({
      species: speciesKey(v.speciesId),
      property: v.property,
      value: v.valueText,
      uncertaintyKind: v.uncertaintyKind,
      uncertainty: v.uncertaintyStated === null ? null : String(v.uncertaintyStated),
      k: v.coverageK,
      source: sourceKey(v.sourceId),
      table: v.tableRef,
      entryNote: v.entryNote,
      provenance: v.provenance,
      provenanceNote: v.provenanceNote,
      pressureBar: v.pressureBar,
      ionConvention: v.ionConvention,
      derivation: v.derivation,
    }))
    .sort(
      (a, b) =>
        byCodeUnits(a.species, b.species) || byCodeUnits(a.property, b.property) || byCodeUnits(a.source, b.source),
    );
  const valueSource = new Map<string, string>();
  for (const v of [...snapshot.values.values()].flat()) valueSource.set(v.id, sourceKey(v.sourceId));
  for (const m of [...snapshot.models.values()].flat()) valueSource.set(m.id, sourceKey(m.sourceId));
  const selections = [...snapshot.selections.values()]
    .filter((s) => valueSource.has(s.valueId))
    .map((s) => ({
      species: speciesKey(s.speciesId),
      property: s.property,
      source: valueSource.get(s.valueId)!,
      reason: s.reason,
    }))
    .sort((a, b) => byCodeUnits(a.species, b.species) || byCodeUnits(a.property, b.property));
  return {
    format: 'thermoledger-library-export',
    version: 1,
    revision: snapshot.revision,
    sources,
    species,
    values,
    selections,
  };
}

/** The values table's columns (FORMAT.md) and the export's own `selected` (yes/no). */
export const valuesCsvColumns = [
  'species',
  'property',
  'value',
  'unit',
  'uncertainty_kind',
  'uncertainty',
  'k',
  'source',
  'table',
  'entry_note',
  'provenance',
  'pressure_bar',
  'ion_convention',
  'note',
  'selected',
] as const;

const units = { dfH298: 'kJ/mol', S298: 'J/(mol K)' } as const;

/**
 * Cells a spreadsheet would run as a formula start with = + - @ tab or CR; papaparse prefixes
 * those with ' (and quotes them). A cell that is a plain decimal number ("-393.51") is left as
 * it is, so numbers, negative ones included, stay numbers.
 */
export const formulaStart = /^(?![-+]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$)[=+\-@\t\r]/;

export function valuesCsv(data: LibraryExport): string {
  const selected = new Set(data.selections.map((s) => `${s.species}|${s.property}|${s.source}`));
  const rows = data.values.map((v) => [
    v.species,
    v.property,
    v.value,
    units[v.property],
    v.uncertaintyKind,
    v.uncertainty ?? '',
    v.k === null ? '' : String(v.k),
    v.source,
    v.table ?? '',
    v.entryNote ?? '',
    v.provenance,
    String(v.pressureBar),
    v.ionConvention ?? '',
    v.provenanceNote ?? '',
    selected.has(`${v.species}|${v.property}|${v.source}`) ? 'yes' : 'no',
  ]);
  return Papa.unparse({ fields: [...valuesCsvColumns], data: rows }, { escapeFormulae: formulaStart, newline: '\r\n' });
}
