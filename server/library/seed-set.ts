import Papa from 'papaparse';
import { z } from 'zod';
import { balanceEquation, molarMass, parseEquation, parseFormula, ratText } from '@shared/chemistry/index';
import { thermoModelIssues, validRange } from '@shared/chemistry/thermo/index';
import { thermoFormSchema, thermoScaleSchema } from '@shared/schemas/thermo';
import {
  libraryPhaseSchema,
  libraryPropertySchema,
  propertyUnits,
  provenanceSchema,
  reactionMethods,
  sourceKindSchema,
  uncertaintyKindSchema,
  type HeatCapacityForm,
  type LibraryPhase,
  type LibraryProperty,
  type ModelScale,
  type Provenance,
  type ReactionMethod,
  type SourceKind,
  type UncertaintyKind,
} from '@shared/schemas/library-core';

/**
 * Reads a set of library files in the seed format (seeds/library/FORMAT.md) into typed records,
 * checking every field, every key and every cross-reference. Used by the seed step (revision 1)
 * and by imports; nothing is written anywhere, so a set with problems changes nothing.
 */

export interface LibraryFile {
  /** File name as the user knows it (for messages), e.g. "values-codata.csv". */
  name: string;
  text: string;
}

/** Where a record was read: file name and line (from 1; the CSV header is line 1). */
export interface Origin {
  file: string;
  line: number;
}

/** One problem in one place: file, line (from 1, the header is line 1) and column name. */
export interface SetProblem {
  file: string;
  line: number;
  column?: string;
  message: string;
}

export interface SourceRecord {
  origin: Origin;
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

export interface SpeciesRecord {
  origin: Origin;
  key: string;
  formula: string;
  hill: string;
  charge: number;
  phase: LibraryPhase;
  descriptor: string | null;
  name: string;
  synonyms: string[];
  cas: string | null;
  inchikey: string | null;
  inchi: string | null;
  referenceState: string | null;
  molarMass: number;
  note: string | null;
}

export interface ValueRecord {
  origin: Origin;
  species: string;
  property: LibraryProperty;
  /** Decimal text as the source prints it. */
  value: string;
  uncertaintyKind: UncertaintyKind;
  uncertainty: string | null;
  k: number | null;
  source: string;
  table: string | null;
  entryNote: string | null;
  provenance: Provenance;
  pressureBar: number;
  ionConvention: string | null;
  note: string | null;
  /** For a value derived in the product (provenance `derived`): its derivation, input weights included. */
  derivation?: Record<string, unknown> | null;
}

export interface ModelRecord {
  origin: Origin;
  species: string;
  source: string;
  entryNote: string | null;
  provenance: Provenance;
  provenanceNote: string | null;
  scale: ModelScale;
  forms: HeatCapacityForm[];
}

export interface SelectionRecord {
  origin: Origin;
  species: string;
  property: LibraryProperty | 'cp';
  source: string;
  reason: string;
}

export { reactionMethods, type ReactionMethod } from '@shared/schemas/library-core';

export interface ReactionRecord {
  origin: Origin;
  key: string;
  /** The equation as written in the file. */
  equation: string;
  /** Signed terms: species key (finite-molality solutes keyed with their molality) and exact coefficient text. */
  terms: { key: string; coefficient: string; finiteMolality: boolean }[];
  deltaH: string;
  uncertaintyKind: UncertaintyKind;
  uncertainty: string | null;
  k: number | null;
  /** K. */
  temperature: number;
  method: ReactionMethod;
  molality: number | null;
  source: string;
  table: string | null;
  /** False when the value restates library values (computed from them): left out of Hess sums. */
  independent: boolean;
  provenance: Provenance;
  note: string | null;
}

/**
 * A row to close (deprecate): a species (with its values, models and selections), a value, a
 * model, a measured reaction or a source, named by the keys the applier matches on.
 */
export interface DeprecationRecord {
  origin: Origin;
  target: 'species' | 'value' | 'model' | 'reaction' | 'source';
  /** The species key (species, value, model), the reaction key or the source key. */
  key: string;
  /** value: its property. */
  property?: LibraryProperty;
  /** value, model: the source key. */
  source?: string;
}

export interface LibrarySet {
  sources: SourceRecord[];
  species: SpeciesRecord[];
  values: ValueRecord[];
  models: ModelRecord[];
  selections: SelectionRecord[];
  reactions: ReactionRecord[];
  /** Rows to close; only amendments carry them (the seed files add and revise only). */
  deprecations?: DeprecationRecord[];
}

const decimalText = /^-?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const optionalText = z
  .string()
  .transform((v) => v.trim())
  .transform((v) => (v === '' ? null : v));
const requiredText = z.string().trim().min(1, 'must not be empty');
const decimal = z.string().trim().regex(decimalText, 'must be a decimal number such as -393.51');
const optionalDecimal = z
  .string()
  .trim()
  .refine((v) => v === '' || decimalText.test(v), 'must be empty or a decimal number')
  .transform((v) => (v === '' ? null : v));

const sourceRow = z.object({
  key: z
    .string()
    .trim()
    .regex(/^[a-z0-9][a-z0-9.-]*$/, 'must be a lower-case slug such as codata-1989'),
  kind: sourceKindSchema,
  authors: requiredText,
  title: requiredText,
  publication: optionalText,
  year: optionalText
    .refine(
      (v) => v === null || (/^\d{4}$/.test(v) && Number(v) >= 1500 && Number(v) <= 2100),
      'must be a year such as 1989',
    )
    .transform((v) => (v === null ? null : Number(v))),
  volume: optionalText,
  pages: optionalText,
  doi: optionalText,
  isbn: optionalText,
  url: optionalText,
  note: optionalText,
});

const casPattern = /^\d{2,7}-\d{2}-\d$/;

/** Whether a CAS Registry Number's check digit is right (weighted sum of the other digits mod 10). */
export function casCheckDigitValid(cas: string): boolean {
  if (!casPattern.test(cas)) return false;
  const digits = cas.replace(/-/g, '');
  const check = Number(digits[digits.length - 1]);
  const body = digits.slice(0, -1).split('').reverse();
  const sum = body.reduce((s, d, i) => s + Number(d) * (i + 1), 0);
  return sum % 10 === check;
}

const speciesRow = z.object({
  key: requiredText,
  formula: requiredText,
  phase: libraryPhaseSchema,
  descriptor: optionalText,
  charge: z
    .string()
    .trim()
    .regex(/^-?\d+$/, 'must be a whole number')
    .transform(Number),
  name: requiredText,
  synonyms: optionalText.transform((v) =>
    v === null
      ? []
      : v
          .split(';')
          .map((s) => s.trim())
          .filter(Boolean),
  ),
  cas: optionalText.refine((v) => v === null || casCheckDigitValid(v), 'is not a valid CAS RN (check digit)'),
  inchikey: optionalText.refine(
    (v) => v === null || /^[A-Z]{14}-[A-Z]{10}-[A-Z]$/.test(v),
    'is not an InChIKey (14-10-1 upper-case letters)',
  ),
  inchi: optionalText.refine((v) => v === null || v.startsWith('InChI='), 'must start with InChI='),
  reference_state: optionalText,
  note: optionalText,
});

const valueRow = z.object({
  species: requiredText,
  property: libraryPropertySchema,
  value: decimal,
  unit: requiredText,
  uncertainty_kind: uncertaintyKindSchema,
  uncertainty: optionalDecimal,
  k: optionalDecimal.transform((v) => (v === null ? null : Number(v))),
  source: requiredText,
  table: optionalText,
  entry_note: optionalText,
  provenance: provenanceSchema,
  pressure_bar: z.enum(['1', '1.01325'], { message: 'must be 1 or 1.01325' }).transform(Number),
  ion_convention: optionalText.refine(
    (v) => v === null || v === 'thermal-electron' || v === 'ion',
    'must be thermal-electron, ion or empty',
  ),
  note: optionalText,
});

const modelLine = z
  .strictObject({
    species: requiredText,
    source: requiredText,
    entryNote: z.string().nullable().optional(),
    provenance: provenanceSchema,
    provenanceNote: z.string().nullable().optional(),
    scale: thermoScaleSchema,
    forms: z.array(thermoFormSchema).min(1),
  })
  // The thermo core's own rules: ranges ascend, forms meet, transitions stated on the relative scale.
  .superRefine((model, ctx) => {
    for (const issue of thermoModelIssues(model))
      ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
  });

const reactionRow = z.object({
  key: z
    .string()
    .trim()
    .regex(/^[a-z0-9][a-z0-9.-]*$/, 'must be a lower-case slug such as combustion-methane'),
  equation: requiredText,
  delta_h: decimal,
  unit: z.literal('kJ/mol', { message: 'must be kJ/mol' }),
  uncertainty_kind: uncertaintyKindSchema,
  uncertainty: optionalDecimal,
  k: optionalDecimal.transform((v) => (v === null ? null : Number(v))),
  temperature: decimal.transform(Number).refine((t) => t > 0, 'must be above 0 K'),
  method: z.enum(reactionMethods),
  molality: optionalDecimal
    .transform((v) => (v === null ? null : Number(v)))
    .refine((m) => m === null || m > 0, 'must be above 0 mol/kg'),
  source: requiredText,
  table: optionalText,
  independent: z.enum(['yes', 'no'], { message: 'must be yes or no' }).transform((v) => v === 'yes'),
  provenance: provenanceSchema,
  note: optionalText,
});

const selectionRow = z.object({
  species: requiredText,
  property: z.enum(['dfH298', 'S298', 'cp']),
  source: requiredText,
  reason: requiredText,
});

function zodProblems(origin: Origin, error: z.ZodError): SetProblem[] {
  return error.issues.map((issue) => {
    const column = issue.path.map(String).join('.') || undefined;
    return { ...origin, ...(column ? { column } : {}), message: `${column ?? 'row'} ${issue.message}` };
  });
}

/** Parses a CSV file with a fixed header; every data row is checked against `schema`. */
function readCsv<S extends z.ZodType>(
  file: LibraryFile,
  header: readonly string[],
  schema: S,
  problems: SetProblem[],
): { row: z.output<S>; origin: Origin }[] {
  const parsed = Papa.parse<Record<string, string>>(file.text, { header: true, skipEmptyLines: 'greedy' });
  const fields = parsed.meta.fields ?? [];
  const missing = header.filter((h) => !fields.includes(h));
  const extra = fields.filter((h) => !header.includes(h));
  if (missing.length > 0 || extra.length > 0) {
    const detail = [
      missing.length ? `missing ${missing.join(', ')}` : '',
      extra.length ? `unknown ${extra.join(', ')}` : '',
    ]
      .filter(Boolean)
      .join('; ');
    problems.push({ file: file.name, line: 1, message: `The header must be ${header.join(',')} (${detail}).` });
    return [];
  }
  const lineOf = rowStartLines(file.text);
  for (const error of parsed.errors) {
    problems.push({ file: file.name, line: lineOf(error.row ?? 0), message: `CSV: ${error.message}` });
  }
  const rows: { row: z.output<S>; origin: Origin }[] = [];
  parsed.data.forEach((raw, i) => {
    const origin = { file: file.name, line: lineOf(i) };
    const checked = schema.safeParse(raw);
    if (!checked.success) problems.push(...zodProblems(origin, checked.error));
    else rows.push({ row: checked.data, origin });
  });
  return rows;
}

/** Maps a data-row index to the line it starts on, honouring quoted fields that span lines. */
function rowStartLines(text: string): (row: number) => number {
  const starts: number[] = [];
  let line = 1;
  let inQuotes = false;
  let atRowStart = false; // the header row is not a data row
  for (const c of text) {
    if (atRowStart && c !== '\n' && c !== '\r') {
      starts.push(line);
      atRowStart = false;
    }
    if (c === '"') inQuotes = !inQuotes;
    else if (c === '\n') {
      line++;
      if (!inQuotes) atRowStart = true;
    }
  }
  return (row) => starts[row] ?? row + 2;
}

/** The columns of each seed file, in order (FORMAT.md); the library import reads the same tables. */
export const seedFileHeaders = {
  sources: ['key', 'kind', 'authors', 'title', 'publication', 'year', 'volume', 'pages', 'doi', 'isbn', 'url', 'note'],
  species: [
    'key',
    'formula',
    'phase',
    'descriptor',
    'charge',
    'name',
    'synonyms',
    'cas',
    'inchikey',
    'inchi',
    'reference_state',
    'note',
  ],
  values: [
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
  ],
  selections: ['species', 'property', 'source', 'reason'],
  reactions: [
    'key',
    'equation',
    'delta_h',
    'unit',
    'uncertainty_kind',
    'uncertainty',
    'k',
    'temperature',
    'method',
    'molality',
    'source',
    'table',
    'independent',
    'provenance',
    'note',
  ],
} as const;

/** Which kind of records a file holds, from its name. */
export function fileKind(
  name: string,
): 'sources' | 'species' | 'values' | 'models' | 'selections' | 'reactions' | null {
  const base = name.split('/').pop() ?? name;
  if (base === 'sources.csv') return 'sources';
  if (base === 'selections.csv') return 'selections';
  if (/^species(-[\w.-]+)?\.csv$/.test(base)) return 'species';
  if (/^values(-[\w.-]+)?\.csv$/.test(base)) return 'values';
  if (/^models(-[\w.-]+)?\.jsonl$/.test(base)) return 'models';
  if (/^reactions(-[\w.-]+)?\.csv$/.test(base)) return 'reactions';
  return null;
}

/**
 * A species key read with the equation core: its formula, Hill formula, charge, phase (`s` read
 * as `cr`), descriptor and molar mass. Throws the core's parse error for text that is not one
 * species, and an Error for a key without a library phase.
 */
export function readSpeciesKey(key: string): {
  formula: string;
  hill: string;
  charge: number;
  phase: LibraryPhase;
  descriptor: string | null;
  molarMass: number;
  elements: string[];
} {
  const parsed = parseFormula(key);
  const phase = parsed.phase === 's' ? 'cr' : parsed.phase;
  const checked = libraryPhaseSchema.safeParse(phase);
  if (!checked.success)
    throw new Error(`a library species needs one of the phases g, l, cr, am, aq (got ${phase ?? 'none'}).`);
  return {
    formula: parsed.formula,
    hill: parsed.hill,
    charge: parsed.charge,
    phase: checked.data,
    descriptor: parsed.descriptor ?? null,
    molarMass: parsed.electron ? 0 : molarMass(parsed.composition).value,
    elements: Object.keys(parsed.composition),
  };
}

/** Reads a species key with the equation core and checks it against the row's own columns. */
function toSpecies(row: z.output<typeof speciesRow>, origin: Origin, problems: SetProblem[]): SpeciesRecord | null {
  let parsed: ReturnType<typeof parseFormula>;
  try {
    parsed = parseFormula(row.key);
  } catch (error) {
    problems.push({
      ...origin,
      column: 'key',
      message: `key '${row.key}' is not a species in the equation language: ${(error as Error).message}`,
    });
    return null;
  }
  const phase = parsed.phase === 's' ? 'cr' : parsed.phase;
  const mismatches: string[] = [];
  if (parsed.formula !== row.formula) mismatches.push(`formula ${parsed.formula} (column says ${row.formula})`);
  if (phase !== row.phase) mismatches.push(`phase ${phase ?? 'none'} (column says ${row.phase})`);
  if ((parsed.descriptor ?? null) !== row.descriptor)
    mismatches.push(`descriptor ${parsed.descriptor ?? 'none'} (column says ${row.descriptor ?? 'none'})`);
  if (parsed.charge !== row.charge) mismatches.push(`charge ${parsed.charge} (column says ${row.charge})`);
  if (mismatches.length > 0) {
    problems.push({ ...origin, column: 'key', message: `key '${row.key}' reads as ${mismatches.join(', ')}.` });
    return null;
  }
  if (row.reference_state !== null && !(row.reference_state in parsed.composition)) {
    problems.push({
      ...origin,
      column: 'reference_state',
      message: `${row.key} cannot be the reference state of ${row.reference_state}: it does not contain it.`,
    });
    return null;
  }
  return {
    origin,
    key: row.key,
    formula: row.formula,
    hill: parsed.hill,
    charge: row.charge,
    phase: row.phase,
    descriptor: row.descriptor,
    name: row.name,
    synonyms: row.synonyms,
    cas: row.cas,
    inchikey: row.inchikey,
    inchi: row.inchi,
    referenceState: row.reference_state,
    molarMass: parsed.electron ? 0 : molarMass(parsed.composition).value,
    note: row.note,
  };
}

/** Checks what a value row's columns say together (unit, uncertainty and its kind, k). */
function toValue(r: z.output<typeof valueRow>, origin: Origin, problems: SetProblem[]): ValueRecord | null {
  const fail = (column: string, message: string) => {
    problems.push({ ...origin, column, message });
    return null;
  };
  if (r.unit !== propertyUnits[r.property])
    return fail('unit', `${r.property} is given in ${propertyUnits[r.property]}, not ${r.unit}.`);
  if (r.uncertainty_kind === 'none' && r.uncertainty !== null)
    return fail('uncertainty', 'uncertainty_kind none takes no uncertainty.');
  if (r.uncertainty_kind !== 'none' && r.uncertainty === null)
    return fail('uncertainty', `uncertainty_kind ${r.uncertainty_kind} needs an uncertainty.`);
  if (r.uncertainty !== null && Number(r.uncertainty) < 0) return fail('uncertainty', 'must not be negative.');
  if ((r.uncertainty_kind === 'expanded') !== (r.k !== null) || (r.k !== null && !(r.k > 0)))
    return fail('k', 'a coverage factor k > 0 goes with an expanded uncertainty, and only with one.');
  return {
    origin,
    species: r.species,
    property: r.property,
    value: r.value,
    uncertaintyKind: r.uncertainty_kind,
    uncertainty: r.uncertainty,
    k: r.k,
    source: r.source,
    table: r.table,
    entryNote: r.entry_note,
    provenance: r.provenance,
    pressureBar: r.pressure_bar,
    ionConvention: r.ion_convention,
    note: r.note,
  };
}

/** The species key of a parsed species: `formula(phase[, descriptor])`, `s` read as `cr`. */
export function keyOfSpecies(species: { formula: string; phase: string | null; descriptor: string | null }): string {
  const phase = species.phase === 's' ? 'cr' : species.phase;
  const inside = [phase, species.descriptor].filter(Boolean).join(', ');
  return inside ? `${species.formula}(${inside})` : species.formula;
}

/** The fields of a reactions-*.csv row once read (what `toReaction` checks together). */
export type ReactionRow = z.output<typeof reactionRow>;

/** Reads a measured reaction's equation: every species with a phase, balanced as written. */
export function toReaction(r: ReactionRow, origin: Origin, problems: SetProblem[]): ReactionRecord | null {
  const fail = (column: string, message: string) => {
    problems.push({ ...origin, column, message });
    return null;
  };
  let parsed: ReturnType<typeof parseEquation>;
  try {
    parsed = parseEquation(r.equation);
  } catch (error) {
    return fail('equation', (error as Error).message);
  }
  const unphased = parsed.terms.filter((t) => !t.species.phase).map((t) => t.species.formula);
  if (unphased.length > 0) return fail('equation', `every species needs its phase: ${unphased.join(', ')}.`);
  if (parsed.heatTerms.length > 0 || parsed.enthalpy)
    return fail('equation', 'write ΔH in the delta_h column, not in the equation.');
  const balance = balanceEquation(parsed, {});
  if (!balance.asGiven) return fail('equation', 'it does not balance as written.');
  if (r.uncertainty_kind === 'none' && r.uncertainty !== null)
    return fail('uncertainty', 'uncertainty_kind none takes no uncertainty.');
  if (r.uncertainty_kind !== 'none' && r.uncertainty === null)
    return fail('uncertainty', `uncertainty_kind ${r.uncertainty_kind} needs an uncertainty.`);
  if ((r.uncertainty_kind === 'expanded') !== (r.k !== null))
    return fail('k', 'a coverage factor k goes with an expanded uncertainty, and only with one.');
  const aqueous = parsed.terms.some((t) => t.species.phase === 'aq');
  if (r.molality !== null && !aqueous) return fail('molality', 'a molality needs aqueous species in the equation.');
  const terms = parsed.terms.map((t) => {
    const finiteMolality = r.molality !== null && t.species.phase === 'aq';
    const key = finiteMolality
      ? keyOfSpecies({ ...t.species, descriptor: `${r.molality} mol/kg` })
      : keyOfSpecies(t.species);
    const sign = t.side === 'reactant' ? '-' : '';
    return { key, coefficient: `${sign}${ratText(t.coefficient)}`, finiteMolality };
  });
  return {
    origin,
    key: r.key,
    equation: r.equation,
    terms,
    deltaH: r.delta_h,
    uncertaintyKind: r.uncertainty_kind,
    uncertainty: r.uncertainty,
    k: r.k,
    temperature: r.temperature,
    method: r.method,
    molality: r.molality,
    source: r.source,
    table: r.table,
    independent: r.independent,
    provenance: r.provenance,
    note: r.note,
  };
}

function readModels(file: LibraryFile, problems: SetProblem[]): ModelRecord[] {
  const out: ModelRecord[] = [];
  file.text.split('\n').forEach((text, i) => {
    if (text.trim() === '') return;
    const origin = { file: file.name, line: i + 1 };
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (error) {
      problems.push({ ...origin, message: `not valid JSON: ${(error as Error).message}` });
      return;
    }
    const checked = modelLine.safeParse(json);
    if (!checked.success) {
      problems.push(...zodProblems(origin, checked.error));
      return;
    }
    const m = checked.data;
    out.push({
      origin,
      species: m.species,
      source: m.source,
      entryNote: m.entryNote ?? null,
      provenance: m.provenance,
      provenanceNote: m.provenanceNote ?? null,
      scale: m.scale,
      forms: m.forms,
    });
  });
  return out;
}

/** The temperature range a model states, in K (its first form's start to its last form's end). */
export function statedRange(model: Pick<ModelRecord, 'species' | 'scale' | 'forms'>): [number, number] {
  const range = validRange(model);
  return [range.statedMin, range.max];
}

/** Cross-references: keys resolve, nothing is given twice, each element has one reference state. */
function crossCheck(set: LibrarySet, problems: SetProblem[], complete: boolean): void {
  const report = (record: { origin: Origin }, message: string, column?: string) =>
    problems.push({ ...record.origin, ...(column ? { column } : {}), message });
  const sourceKeys = new Set<string>();
  for (const s of set.sources) {
    if (sourceKeys.has(s.key)) report(s, `source ${s.key} is listed twice.`, 'key');
    sourceKeys.add(s.key);
  }
  const speciesKeys = new Map<string, SpeciesRecord>();
  const referenceOf = new Map<string, SpeciesRecord>();
  for (const s of set.species) {
    const seen = speciesKeys.get(s.key);
    if (seen) report(s, `species ${s.key} is already defined in ${seen.origin.file} line ${seen.origin.line}.`, 'key');
    speciesKeys.set(s.key, s);
    if (!s.referenceState) continue;
    const other = referenceOf.get(s.referenceState);
    if (other) report(s, `${s.referenceState} already has its reference state, ${other.key}.`, 'reference_state');
    referenceOf.set(s.referenceState, s);
  }
  const valueKeys = new Set<string>();
  for (const v of set.values) {
    if (complete && !speciesKeys.has(v.species)) report(v, `unknown species ${v.species}.`, 'species');
    if (complete && !sourceKeys.has(v.source)) report(v, `unknown source ${v.source}.`, 'source');
    const id = `${v.species}|${v.property}|${v.source}`;
    if (valueKeys.has(id)) report(v, `${v.property} of ${v.species} from ${v.source} is given twice.`);
    valueKeys.add(id);
  }
  const modelKeys = new Set<string>();
  for (const m of set.models) {
    if (complete && !speciesKeys.has(m.species)) report(m, `unknown species ${m.species}.`, 'species');
    if (complete && !sourceKeys.has(m.source)) report(m, `unknown source ${m.source}.`, 'source');
    const id = `${m.species}|${m.source}`;
    if (modelKeys.has(id)) report(m, `a model of ${m.species} from ${m.source} is given twice.`);
    modelKeys.add(id);
  }
  const reactionKeys = new Set<string>();
  for (const r of set.reactions) {
    if (reactionKeys.has(r.key)) report(r, `reaction ${r.key} is given twice.`, 'key');
    reactionKeys.add(r.key);
    if (complete && !sourceKeys.has(r.source)) report(r, `unknown source ${r.source}.`, 'source');
    if (!complete) continue;
    const unknown = r.terms.filter((t) => !t.finiteMolality && !speciesKeys.has(t.key)).map((t) => t.key);
    if (unknown.length > 0) report(r, `unknown species ${unknown.join(', ')}.`, 'equation');
  }
  const selected = new Set<string>();
  for (const s of set.selections) {
    const id = `${s.species}|${s.property}`;
    if (selected.has(id)) report(s, `${s.property} of ${s.species} is selected twice.`);
    selected.add(id);
    const exists = s.property === 'cp' ? modelKeys.has(`${s.species}|${s.source}`) : valueKeys.has(`${id}|${s.source}`);
    if (complete && !exists)
      report(s, `there is no ${s.property} of ${s.species} from ${s.source} to select.`, 'source');
  }
}

/**
 * Reads and cross-checks a set. Problems name file, line and column; when there is any problem
 * the caller must not apply the set. A `complete` set (the seed) must resolve every key within
 * itself; a partial one (an import) may name species and sources already in the library, which
 * applying it checks.
 */
export function readLibrarySet(
  files: readonly LibraryFile[],
  { complete = true }: { complete?: boolean } = {},
): { set: LibrarySet; problems: SetProblem[] } {
  const problems: SetProblem[] = [];
  const set: LibrarySet = { sources: [], species: [], values: [], models: [], selections: [], reactions: [] };
  for (const file of files) {
    switch (fileKind(file.name)) {
      case 'sources':
        for (const { row, origin } of readCsv(file, seedFileHeaders.sources, sourceRow, problems))
          set.sources.push({ ...row, origin });
        break;
      case 'species':
        for (const { row, origin } of readCsv(file, seedFileHeaders.species, speciesRow, problems)) {
          const record = toSpecies(row, origin, problems);
          if (record) set.species.push(record);
        }
        break;
      case 'values':
        for (const { row, origin } of readCsv(file, seedFileHeaders.values, valueRow, problems)) {
          const record = toValue(row, origin, problems);
          if (record) set.values.push(record);
        }
        break;
      case 'models':
        set.models.push(...readModels(file, problems));
        break;
      case 'selections':
        for (const { row, origin } of readCsv(file, seedFileHeaders.selections, selectionRow, problems))
          set.selections.push({ ...row, origin });
        break;
      case 'reactions':
        for (const { row, origin } of readCsv(file, seedFileHeaders.reactions, reactionRow, problems)) {
          const record = toReaction(row, origin, problems);
          if (record) set.reactions.push(record);
        }
        break;
      default:
        problems.push({
          file: file.name,
          line: 1,
          message:
            'Unknown file: name it sources.csv, species-*.csv, values-*.csv, models-*.jsonl, reactions-*.csv or selections.csv.',
        });
    }
  }
  crossCheck(set, problems, complete);
  return { set, problems };
}
