import type { z } from 'zod';
import { standardUncertainty, ThermoInputError } from '@shared/chemistry/thermo/index';
import { amendmentEntrySchema, type AmendmentEntry } from '@shared/schemas/amendments';
import type { ImportProblem, ImportTable, LibraryExport } from '@shared/schemas/library-io';
import { seedFileHeaders } from '../library/seed-set';
import type { ReadTable, TableRow } from './read-table';

/**
 * Turns rows of the library's tables (seeds/library/FORMAT.md) into amendment entries: sources
 * → set-source, species → set-species, values → revise-value, selections → select-value. Every
 * entry is checked with the amendment schemas; a problem names the row's line and the column.
 */

/** Columns each table must have: the header decides which table a file holds. */
export const tableColumns: Record<ImportTable, readonly string[]> = {
  sources: ['key', 'kind', 'authors', 'title'],
  species: ['key', 'name'],
  values: ['species', 'property', 'value', 'uncertainty_kind', 'source'],
  selections: ['species', 'property', 'source', 'reason'],
};

/** Every column each table may have (FORMAT.md, plus `selected` on values from our CSV export). */
export const knownColumns: Record<ImportTable, readonly string[]> = {
  sources: seedFileHeaders.sources,
  species: seedFileHeaders.species,
  values: [...seedFileHeaders.values, 'selected'],
  selections: seedFileHeaders.selections,
};

/** The table a header row belongs to (the one whose required columns it has, most specific first). */
export function tableOf(header: readonly string[]): ImportTable | null {
  for (const table of ['values', 'selections', 'sources', 'species'] as const)
    if (tableColumns[table].every((c) => header.includes(c))) return table;
  return null;
}

/** Where an entry came from, so plan problems (entries.N.field) map back to file, line and column. */
export interface EntryOrigin {
  file: string;
  line: number | null;
  /** Entry field (first path segment) → column name. */
  columns: Record<string, string>;
}

export interface ConvertedRows {
  entries: AmendmentEntry[];
  origins: EntryOrigin[];
  problems: ImportProblem[];
}

const units = { dfH298: 'kJ/mol', S298: 'J/(mol K)' } as const;

const blankToNull = (cell: string | undefined): string | null => {
  const t = (cell ?? '').trim();
  return t === '' ? null : t;
};

class RowProblem extends Error {
  constructor(
    readonly column: string,
    message: string,
  ) {
    super(message);
  }
}

function numberCell(cells: Record<string, string>, column: string): number | null {
  const text = blankToNull(cells[column]);
  if (text === null) return null;
  if (!/^[-+]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(text))
    throw new RowProblem(column, `"${text}" is not a number.`);
  return Number(text);
}

const sourceColumns: Record<string, string> = { source: 'key', id: 'key' };
const speciesColumns: Record<string, string> = { key: 'key', name: 'name', synonyms: 'synonyms', cas: 'cas' };
const valueColumns: Record<string, string> = {
  species: 'species',
  deltaFH: 'value',
  entropy: 'value',
  valueText: 'value',
  stated: 'uncertainty',
  source: 'source',
  table: 'table',
  entryNote: 'entry_note',
  provenance: 'provenance',
  provenanceNote: 'note',
  pressureBar: 'pressure_bar',
  ionConvention: 'ion_convention',
  select: 'selected',
};
const selectionColumns: Record<string, string> = {
  species: 'species',
  property: 'property',
  source: 'source',
  reason: 'reason',
};
const columnsOf: Record<ImportTable, Record<string, string>> = {
  sources: sourceColumns,
  species: speciesColumns,
  values: valueColumns,
  selections: selectionColumns,
};

function sourceEntry(c: Record<string, string>): unknown {
  const year = numberCell(c, 'year');
  return {
    kind: 'set-source',
    source: {
      key: c.key ?? '',
      kind: c.kind ?? '',
      authors: c.authors ?? '',
      title: c.title ?? '',
      publication: blankToNull(c.publication),
      year,
      volume: blankToNull(c.volume),
      pages: blankToNull(c.pages),
      doi: blankToNull(c.doi),
      isbn: blankToNull(c.isbn),
      url: blankToNull(c.url),
      note: blankToNull(c.note),
    },
  };
}

function speciesEntry(c: Record<string, string>): unknown {
  const synonyms = blankToNull(c.synonyms);
  return {
    kind: 'set-species',
    key: c.key ?? '',
    name: c.name ?? '',
    ...(c.synonyms !== undefined
      ? { synonyms: synonyms === null ? [] : synonyms.split(';').map((s) => s.trim()) }
      : {}),
    ...(c.cas !== undefined ? { cas: blankToNull(c.cas) } : {}),
    ...(c.inchikey !== undefined ? { inchikey: blankToNull(c.inchikey) } : {}),
    ...(c.inchi !== undefined ? { inchi: blankToNull(c.inchi) } : {}),
    ...(c.note !== undefined ? { note: blankToNull(c.note) } : {}),
  };
}

/** The standard uncertainty the amendment expects beside the stated one (the library's own rule). */
function standardOf(kind: string, value: number | null, k: number | null): number | null {
  if (kind === 'none' || value === null) return null;
  try {
    return standardUncertainty(
      kind === 'expanded'
        ? { kind: 'expanded', value, k: k ?? Number.NaN }
        : { kind: kind as 'standard' | 'two-sigma' | 'interval', value },
    ).u;
  } catch (error) {
    if (error instanceof ThermoInputError)
      throw new RowProblem(kind === 'expanded' ? 'k' : 'uncertainty', error.message);
    throw error;
  }
}

function valueEntry(c: Record<string, string>): unknown {
  const property = (c.property ?? '').trim();
  if (property !== 'dfH298' && property !== 'S298')
    throw new RowProblem('property', `"${property}" is not a property of a value: write dfH298 or S298.`);
  const unit = blankToNull(c.unit);
  if (unit !== null && unit !== units[property])
    throw new RowProblem('unit', `${property} is given in ${units[property]}, not "${unit}".`);
  const value = numberCell(c, 'value');
  if (value === null) throw new RowProblem('value', 'Write the value.');
  const kind = (c.uncertainty_kind ?? '').trim();
  const uncertainty = numberCell(c, 'uncertainty');
  const k = numberCell(c, 'k');
  const pressure = numberCell(c, 'pressure_bar');
  const selected = blankToNull(c.selected);
  if (selected !== null && selected !== 'yes' && selected !== 'no')
    throw new RowProblem('selected', `"${selected}" is neither yes nor no.`);
  const known = ['standard', 'expanded', 'two-sigma', 'interval', 'none'];
  const given = { value, uncertainty: known.includes(kind) ? standardOf(kind, uncertainty, k) : null };
  return {
    kind: 'revise-value',
    species: c.species ?? '',
    [property === 'dfH298' ? 'deltaFH' : 'entropy']: given,
    valueText: (c.value ?? '').trim(),
    stated: { kind, value: uncertainty, k },
    source: { key: (c.source ?? '').trim() },
    table: blankToNull(c.table),
    entryNote: blankToNull(c.entry_note),
    ...(blankToNull(c.provenance) !== null ? { provenance: blankToNull(c.provenance) } : {}),
    provenanceNote: blankToNull(c.note),
    ...(pressure !== null ? { pressureBar: pressure } : {}),
    ionConvention: blankToNull(c.ion_convention),
    select: selected === 'yes',
  };
}

function selectionEntry(c: Record<string, string>): unknown {
  return {
    kind: 'select-value',
    species: c.species ?? '',
    property: (c.property ?? '').trim(),
    source: { key: (c.source ?? '').trim() },
    reason: c.reason ?? '',
  };
}

const builders: Record<ImportTable, (cells: Record<string, string>) => unknown> = {
  sources: sourceEntry,
  species: speciesEntry,
  values: valueEntry,
  selections: selectionEntry,
};

/** Column of a schema issue path: the row's column when known, else the field path. */
function columnFor(table: ImportTable, path: readonly PropertyKey[]): string {
  const fields = path.map(String);
  if (table === 'sources' && fields[0] === 'source' && fields[1]) return fields[1];
  if (table === 'values' && fields[0] === 'stated')
    return fields[1] === 'k' ? 'k' : fields[1] === 'kind' ? 'uncertainty_kind' : 'uncertainty';
  if (table === 'values' && (fields[0] === 'deltaFH' || fields[0] === 'entropy'))
    return fields[1] === 'uncertainty' ? 'uncertainty' : 'value';
  return columnsOf[table][fields[0] ?? ''] ?? (fields.join('.') || 'row');
}

/** Converts one row; problems (all of them) are pushed onto `problems`. */
function convertRow(table: ImportTable, file: string, row: TableRow, problems: ImportProblem[]): AmendmentEntry | null {
  let candidate: unknown;
  try {
    candidate = builders[table](row.cells);
  } catch (error) {
    if (!(error instanceof RowProblem)) throw error;
    problems.push({ file, line: row.line, column: error.column, reason: error.message });
    return null;
  }
  const parsed = amendmentEntrySchema.safeParse(candidate);
  if (parsed.success) return parsed.data;
  for (const issue of (parsed.error as z.ZodError).issues)
    problems.push({ file, line: row.line, column: columnFor(table, issue.path), reason: issue.message });
  return null;
}

/** Which order tables apply in: sources and species before the values and selections naming them. */
const tableOrder: readonly ImportTable[] = ['sources', 'species', 'values', 'selections'];

/** Converts read tables to entries, sources first; `onRow` reports progress every row. */
export async function tablesToEntries(
  tables: readonly ReadTable[],
  onRows: (done: number) => void,
  chunk = 500,
): Promise<ConvertedRows> {
  const out: ConvertedRows = { entries: [], origins: [], problems: [] };
  const typed: { table: ImportTable; read: ReadTable }[] = [];
  for (const read of tables) {
    out.problems.push(...read.problems);
    const table = tableOf(read.header);
    if (table === null) {
      out.problems.push({
        file: read.file,
        line: 1,
        column: null,
        reason: `The header matches none of the library's tables (sources, species, values, selections in seeds/library/FORMAT.md).`,
      });
      continue;
    }
    for (const column of read.header)
      if (!knownColumns[table].includes(column))
        out.problems.push({
          file: read.file,
          line: 1,
          column,
          reason: `"${column}" is not a column of the ${table} table.`,
        });
    typed.push({ table, read });
  }
  let done = 0;
  for (const table of tableOrder)
    for (const { read } of typed.filter((t) => t.table === table))
      for (const row of read.rows) {
        const entry = convertRow(table, read.file, row, out.problems);
        if (entry) {
          out.entries.push(entry);
          out.origins.push({ file: read.file, line: row.line, columns: columnsOf[table] });
        }
        // Yield to the event loop between chunks, so a large import neither blocks other requests nor hides its progress.
        if (++done % chunk === 0) {
          onRows(done);
          await new Promise((resolve) => setImmediate(resolve));
        }
      }
  onRows(done);
  return out;
}

/** The JSON export as tables of rows (so it is checked exactly as a CSV would be). */
export function exportToTables(file: string, data: LibraryExport): ReadTable[] {
  const text = (v: string | number | null) => (v === null ? '' : String(v));
  // A problem names the table and the item's number in it (1 = the first): "library.json values", line 12.
  const table = (name: string, header: string[], rows: Record<string, string>[]): ReadTable => ({
    file: `${file} ${name}`,
    header,
    rows: rows.map((cells, index) => ({ line: index + 1, cells })),
    problems: [],
  });
  return [
    table(
      'sources',
      ['key', 'kind', 'authors', 'title', 'publication', 'year', 'volume', 'pages', 'doi', 'isbn', 'url', 'note'],
      data.sources.map((s) => ({
        key: s.key,
        kind: s.kind,
        authors: s.authors,
        title: s.title,
        publication: text(s.publication),
        year: text(s.year),
        volume: text(s.volume),
        pages: text(s.pages),
        doi: text(s.doi),
        isbn: text(s.isbn),
        url: text(s.url),
        note: text(s.note),
      })),
    ),
    table(
      'species',
      ['key', 'name', 'synonyms', 'cas', 'inchikey', 'inchi', 'note'],
      data.species.map((s) => ({
        key: s.key,
        name: s.name,
        synonyms: s.synonyms.join(';'),
        cas: text(s.cas),
        inchikey: text(s.inchikey),
        inchi: text(s.inchi),
        note: text(s.note),
      })),
    ),
    table(
      'values',
      [...knownColumns.values],
      data.values.map((v) => ({
        species: v.species,
        property: v.property,
        value: v.value,
        unit: units[v.property],
        uncertainty_kind: v.uncertaintyKind,
        uncertainty: text(v.uncertainty),
        k: text(v.k),
        source: v.source,
        table: text(v.table),
        entry_note: text(v.entryNote),
        provenance: v.provenance,
        pressure_bar: text(v.pressureBar),
        ion_convention: text(v.ionConvention),
        note: text(v.provenanceNote),
        // Selections come from the selections table, with their reasons.
        selected: 'no',
      })),
    ),
    table(
      'selections',
      ['species', 'property', 'source', 'reason'],
      data.selections.map((s) => ({ species: s.species, property: s.property, source: s.source, reason: s.reason })),
    ),
  ];
}
