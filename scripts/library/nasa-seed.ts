/**
 * The NASA TM-4513 import as a pure function: source entries + the label table in, the text of the
 * seed files out (seeds/library/FORMAT.md). No I/O here, so the test can re-run it and compare
 * with the committed files; `import-nasa.ts` reads and writes.
 *
 * Source: McBride, Gordon & Reno, NASA TM-4513 (1993), copied in seeds/source-data/nasa-tm4513/.
 */
import { z } from 'zod';
import { parseFormula, ratToNumber } from '../../shared/chemistry/index';
import type { NasaExclusion, NasaLabelRow, NasaPhase } from './nasa-labels';
import {
  coversReferenceTemperature,
  evaluateAtReference,
  evaluateNasa,
  rangeIndexAt,
  R_J_PER_MOL_K,
  T_REF,
  type NasaKind,
} from './nasa-polynomials';
import { toCsv } from './seed-csv';

export const NASA_SOURCE_KEY = 'nasa-tm4513';

export const SPECIES_HEADER = [
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
] as const;
export const VALUES_HEADER = [
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
] as const;
export const SOURCES_HEADER = [
  'key',
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

/** |H°(298.15 K)| a reference-state polynomial may show before the import refuses it, kJ/mol. */
const REFERENCE_STATE_TOLERANCE_KJ = 0.005;

const sourceLineSchema = z.object({
  name: z.string().min(1),
  composition: z.record(z.string(), z.number()),
  model: z.enum(['NASA7', 'NASA9']),
  ranges: z.array(z.number()).min(2),
  coefficients: z.array(z.array(z.number())).min(1),
  note: z.string(),
});

/** One entry of gas.jsonl or condensed.jsonl, with where it came from. */
export interface NasaSourceEntry {
  label: string;
  file: string;
  line: number;
  composition: Record<string, number>;
  kind: NasaKind;
  ranges: number[];
  coefficients: number[][];
  note: string;
}

/** The import refused its input; `problems` lists every reason, each naming the label. */
export class NasaImportError extends Error {
  constructor(readonly problems: readonly string[]) {
    super(
      `the NASA TM-4513 import stopped (${problems.length} problem${problems.length === 1 ? '' : 's'}):\n  - ${problems.join('\n  - ')}`,
    );
    this.name = 'NasaImportError';
  }
}

/** Reads one source file (JSON Lines); a bad line stops with the file and line number. */
export function readSourceJsonl(text: string, file: string): NasaSourceEntry[] {
  const entries: NasaSourceEntry[] = [];
  const problems: string[] = [];
  text.split('\n').forEach((raw, i) => {
    if (raw.trim() === '') return;
    let json: unknown;
    try {
      json = JSON.parse(raw);
    } catch (err) {
      problems.push(`${file} line ${i + 1}: not JSON (${(err as Error).message})`);
      return;
    }
    const parsed = sourceLineSchema.safeParse(json);
    if (!parsed.success) {
      const issue = parsed.error.issues[0]!;
      problems.push(`${file} line ${i + 1}: field '${issue.path.join('.')}': ${issue.message}`);
      return;
    }
    const d = parsed.data;
    entries.push({
      label: d.name,
      file,
      line: i + 1,
      composition: d.composition,
      kind: d.model === 'NASA7' ? 'nasa7' : 'nasa9',
      ranges: d.ranges,
      coefficients: d.coefficients,
      note: d.note,
    });
  });
  if (problems.length > 0) throw new NasaImportError(problems);
  return entries;
}

/** One form of a species: the label row, its source entry and the note the library keeps. */
interface SpeciesForm {
  row: NasaLabelRow;
  entry: NasaSourceEntry;
  note: string;
}

interface BuiltSpecies {
  key: string;
  formula: string;
  phase: NasaPhase;
  descriptor: string;
  charge: number;
  first: NasaLabelRow;
  forms: SpeciesForm[];
}

export function speciesKey(row: Pick<NasaLabelRow, 'formula' | 'phase' | 'descriptor'>): string {
  return `${row.formula}(${row.phase}${row.descriptor ? `, ${row.descriptor}` : ''})`;
}

/** CAS Registry Number check digit: Σ (position from the right × digit) mod 10. */
export function casCheckDigitValid(cas: string): boolean {
  const m = /^(\d{2,7})-(\d{2})-(\d)$/.exec(cas);
  if (!m) return false;
  const digits = (m[1]! + m[2]!).split('').reverse();
  const sum = digits.reduce((acc, d, i) => acc + (i + 1) * Number(d), 0);
  return sum % 10 === Number(m[3]);
}

function compositionText(c: Record<string, number>): string {
  return Object.keys(c)
    .sort()
    .map((k) => `${k}${c[k]}`)
    .join(' ');
}

/** Checks one label row against its source entry; returns problems (empty when it matches). */
function checkRow(row: NasaLabelRow, entry: NasaSourceEntry): string[] {
  const problems: string[] = [];
  const where = `label '${row.label}' (${entry.file} line ${entry.line})`;
  const key = speciesKey(row);
  let parsed: ReturnType<typeof parseFormula>;
  try {
    parsed = parseFormula(key);
  } catch (err) {
    return [`${where}: the key '${key}' does not parse: ${(err as Error).message}`];
  }
  if (parsed.warnings.length > 0)
    problems.push(`${where}: the key '${key}' reads with a warning: ${parsed.warnings[0]!.message}`);
  if (parsed.formula !== row.formula)
    problems.push(`${where}: formula '${row.formula}' reads back as '${parsed.formula}'; write it that way`);
  if (parsed.phase !== row.phase || (parsed.descriptor ?? '') !== (row.descriptor ?? '')) {
    problems.push(
      `${where}: the key '${key}' reads back with phase '${parsed.phase}' and descriptor '${parsed.descriptor ?? ''}'`,
    );
  }
  // The source writes a cation's missing electron as E: -1 and an anion's extra one as E: 1.
  const sourceAtoms: Record<string, number> = {};
  for (const [el, n] of Object.entries(entry.composition)) {
    if (!Number.isInteger(n))
      problems.push(`${where}: fractional count ${el} ${n} in the source: a mixture, not a species`);
    if (el !== 'E') sourceAtoms[el] = n;
  }
  const sourceCharge = -(entry.composition.E ?? 0);
  const ours = compositionText(
    Object.fromEntries(Object.entries(parsed.composition).map(([el, n]) => [el, ratToNumber(n)])),
  );
  const theirs = compositionText(sourceAtoms);
  if (ours !== theirs)
    problems.push(`${where}: '${key}' has composition ${ours || '(none)'}, the source ${theirs || '(none)'}`);
  if (parsed.charge !== sourceCharge)
    problems.push(
      `${where}: '${key}' has charge ${parsed.charge}, the source ${sourceCharge} (E: ${entry.composition.E ?? 0})`,
    );
  // Shape of the fit: ascending breakpoints, one coefficient set per range, 7 or 9 terms.
  const width = entry.kind === 'nasa7' ? 7 : 9;
  if (entry.ranges.some((t, i) => i > 0 && !(t > entry.ranges[i - 1]!)))
    problems.push(`${where}: ranges ${JSON.stringify(entry.ranges)} do not ascend`);
  if (entry.coefficients.length !== entry.ranges.length - 1)
    problems.push(`${where}: ${entry.ranges.length - 1} ranges but ${entry.coefficients.length} coefficient sets`);
  if (entry.coefficients.some((c) => c.length !== width))
    problems.push(`${where}: a ${entry.kind} set does not have ${width} coefficients`);
  if (row.cas !== undefined && !casCheckDigitValid(row.cas))
    problems.push(`${where}: CAS RN '${row.cas}' fails its check digit`);
  return problems;
}

/** The source note without the label word that spilled into it (declared in the table). */
function keptNote(spill: string | undefined, entry: NasaSourceEntry, problems: string[]): string {
  if (spill === undefined) return entry.note;
  if (!entry.note.startsWith(`${spill} `)) {
    problems.push(`label '${entry.label}': the note '${entry.note}' does not start with the declared spill '${spill}'`);
    return entry.note;
  }
  return entry.note.slice(spill.length + 1);
}

function fixed4(x: number): string {
  const s = x.toFixed(4);
  return s === '-0.0000' ? '0.0000' : s;
}

function temperatureText(t: number): string {
  return String(t);
}

/** Notes of the forms, each kept once; a note that only repeats the start of a longer one is dropped. */
function combinedEntryNote(notes: readonly string[]): string {
  const distinct = [...new Set(notes)];
  return distinct.filter((n) => !distinct.some((m) => m !== n && m.startsWith(n))).join(' | ');
}

/** What the import wrote, plus counts for the report. */
export interface NasaSeed {
  speciesCsv: string;
  valuesCsv: string;
  modelsJsonl: string;
  /** The `nasa-tm4513` record of sources.csv, fields in SOURCES_HEADER order. */
  sourceRecord: readonly string[];
  counts: { species: number; values: number; models: number; excluded: number };
}

/** The `nasa-tm4513` row of sources.csv. */
export const NASA_SOURCE_RECORD: readonly string[] = [
  NASA_SOURCE_KEY,
  'report',
  'McBride, B. J.; Gordon, S.; Reno, M. A.',
  'Coefficients for Calculating Thermodynamic and Transport Properties of Individual Species',
  'NASA Technical Memorandum 4513',
  '1993',
  '',
  '',
  '',
  '',
  '',
  "October 1993. Coefficients as redistributed, values unchanged, with the open-source Cantera data files nasa_gas.yaml and nasa_condensed.yaml (BSD 3-clause); copied in seeds/source-data/nasa-tm4513/. Each entry keeps the report's note on the origin of its fit (J = JANAF tables, TPIS = Gurvich et al., CODA89 = CODATA Key Values 1989, L = NASA Lewis).",
];

/**
 * Builds the seed files from the source entries and the label table.
 *
 * @throws NasaImportError listing every mismatch: an unmapped or doubly mapped label, a key that
 *   does not parse or disagrees with the source's composition or charge, forms that do not join,
 *   a reference state whose polynomial does not give H°(298.15 K) ≈ 0, or a bad electron entry.
 */
export function buildNasaSeed(
  gas: readonly NasaSourceEntry[],
  condensed: readonly NasaSourceEntry[],
  labels: readonly NasaLabelRow[],
  exclusions: readonly NasaExclusion[],
): NasaSeed {
  const problems: string[] = [];
  const entries = [...gas, ...condensed];

  // Every label mapped or excluded, exactly once; no row for a label the source lacks.
  const rowByLabel = new Map<string, NasaLabelRow>();
  for (const row of labels) {
    if (rowByLabel.has(row.label)) problems.push(`label '${row.label}' is mapped twice`);
    rowByLabel.set(row.label, row);
  }
  const exclusionByLabel = new Map<string, NasaExclusion>();
  for (const ex of exclusions) {
    if (rowByLabel.has(ex.label) || exclusionByLabel.has(ex.label))
      problems.push(`label '${ex.label}' is both mapped and excluded, or excluded twice`);
    if (ex.reason.trim() === '') problems.push(`label '${ex.label}' is excluded without a reason`);
    exclusionByLabel.set(ex.label, ex);
  }
  const seen = new Set<string>();
  for (const e of entries) {
    if (seen.has(e.label)) problems.push(`${e.file} line ${e.line}: label '${e.label}' occurs twice in the source`);
    seen.add(e.label);
    if (!rowByLabel.has(e.label) && !exclusionByLabel.has(e.label)) {
      problems.push(
        `${e.file} line ${e.line}: label '${e.label}' is neither mapped nor excluded in scripts/library/nasa-labels.ts`,
      );
    }
  }
  for (const label of [...rowByLabel.keys(), ...exclusionByLabel.keys()]) {
    if (!seen.has(label)) problems.push(`label '${label}' in scripts/library/nasa-labels.ts is not in the source`);
  }
  for (const ex of exclusions) {
    const entry = entries.find((e) => e.label === ex.label);
    if (entry && ex.noteSpill !== undefined) keptNote(ex.noteSpill, entry, problems);
  }

  // Check each mapped entry, then group: consecutive solids of one key are one species' forms.
  const species: BuiltSpecies[] = [];
  const byKey = new Map<string, BuiltSpecies>();
  for (const entry of entries) {
    const row = rowByLabel.get(entry.label);
    if (!row) continue;
    problems.push(...checkRow(row, entry));
    if (entry.file.startsWith('gas') !== (row.phase === 'g'))
      problems.push(`label '${row.label}': phase '${row.phase}' does not fit ${entry.file}`);
    const note = keptNote(row.noteSpill, entry, problems);
    const key = speciesKey(row);
    const last = species[species.length - 1];
    if (row.phase === 'cr' && last && last.key === key) {
      last.forms.push({ row, entry, note });
      continue;
    }
    if (byKey.has(key)) {
      problems.push(
        `label '${row.label}': species '${key}' already made from '${byKey.get(key)!.first.label}' and not its next form`,
      );
      continue;
    }
    const built: BuiltSpecies = {
      key,
      formula: row.formula,
      phase: row.phase,
      descriptor: row.descriptor ?? '',
      charge: -(entry.composition.E ?? 0),
      first: row,
      forms: [{ row, entry, note }],
    };
    species.push(built);
    byKey.set(key, built);
  }

  for (const sp of species) {
    if (!sp.first.name) problems.push(`label '${sp.first.label}': species '${sp.key}' needs a name`);
    if (
      sp.first.referenceState !== undefined &&
      (sp.charge !== 0 || sp.formula.replace(/\d+$/, '') !== sp.first.referenceState)
    ) {
      problems.push(
        `label '${sp.first.label}': '${sp.key}' cannot be the reference state of ${sp.first.referenceState}`,
      );
    }
    sp.forms.forEach((f, i) => {
      if (i === 0) return;
      const r = f.row;
      if (r.name !== undefined || r.synonyms !== undefined || r.cas !== undefined || r.referenceState !== undefined) {
        problems.push(
          `label '${r.label}': a later form of '${sp.key}' carries species details; keep them on '${sp.first.label}'`,
        );
      }
      const prev = sp.forms[i - 1]!;
      if (!r.form || !prev.row.form) problems.push(`label '${r.label}': every form of '${sp.key}' needs a form label`);
      const joint = prev.entry.ranges[prev.entry.ranges.length - 1];
      if (joint !== f.entry.ranges[0]) {
        problems.push(
          `label '${r.label}': forms of '${sp.key}' do not join (${prev.row.label} ends at ${joint} K, ${r.label} starts at ${f.entry.ranges[0]} K)`,
        );
      }
    });
    if (sp.phase !== 'cr' && sp.first.form !== undefined)
      problems.push(`label '${sp.first.label}': only crystalline species have forms`);
  }

  // Thermal-electron convention: the report's electron has Cp = 5/2 R and H°(298.15 K) = 0, i.e. it
  // is an ideal gas carrying its own thermal enthalpy (under the "ion" convention it would have
  // H = 0 at every T). Cations then carry +5/2 RT per missing electron relative to that
  // convention (domain notes §1; JANAF/NASA practice). Checked here, not assumed.
  const electron = byKey.get('e^-(g)');
  if (!electron) problems.push(`the electron 'e^-(g)' is missing, so the ion convention cannot be checked`);
  else {
    const e = electron.forms[0]!.entry;
    const at298 = evaluateNasa(e.kind, e.coefficients[0]!, T_REF);
    const at1000 = evaluateNasa(e.kind, e.coefficients[rangeIndexAt(e.ranges, 1000)]!, 1000);
    if (
      Math.abs(at298.h) > 1e-6 ||
      Math.abs(at298.cp - 2.5 * R_J_PER_MOL_K) > 1e-9 ||
      Math.abs(at1000.cp - 2.5 * R_J_PER_MOL_K) > 1e-9
    ) {
      problems.push(
        `the electron's polynomial gives H°(298.15 K) = ${at298.h} kJ/mol and Cp = ${at298.cp} J/(mol K): not the thermal-electron convention`,
      );
    }
  }

  if (problems.length > 0) throw new NasaImportError(problems);

  // Values, models, species rows.
  const sorted = [...species].sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
  const speciesRows: string[][] = [];
  const valueRows: string[][] = [];
  const modelLines: string[] = [];
  for (const sp of sorted) {
    const first = sp.forms[0]!;
    const t0 = first.entry.ranges[0]!;
    const t1 = first.entry.ranges[first.entry.ranges.length - 1]!;
    const hasValue = coversReferenceTemperature(first.entry.ranges);
    const labelsText = `TM-4513 label${sp.forms.length > 1 ? 's' : ''}: ${sp.forms.map((f) => f.row.label).join(', ')}`;
    const noValueText = hasValue
      ? ''
      : `; no value at 298.15 K: the fit covers ${temperatureText(t0)}–${temperatureText(t1)} K`;
    speciesRows.push([
      sp.key,
      sp.formula,
      sp.phase,
      sp.descriptor,
      String(sp.charge),
      sp.first.name ?? '',
      (sp.first.synonyms ?? []).join(';'),
      sp.first.cas ?? '',
      '',
      '',
      sp.first.referenceState ?? '',
      labelsText + noValueText,
    ]);

    if (hasValue) {
      const at = evaluateAtReference(first.entry);
      const ionConvention = sp.phase === 'g' && sp.charge !== 0 ? 'thermal-electron' : '';
      const fromText = `from the polynomial of ${first.row.label} at 298.15 K`;
      const below =
        t0 > T_REF
          ? `; the fit starts at ${temperatureText(t0)} K and is used ${(t0 - T_REF).toFixed(2)} K below it`
          : '';
      let dfH = fixed4(at.h);
      let dfHNote = fromText + below;
      if (sp.first.referenceState !== undefined) {
        if (Math.abs(at.h) > REFERENCE_STATE_TOLERANCE_KJ) {
          throw new NasaImportError([
            `label '${first.row.label}': reference state '${sp.key}' has H°(298.15 K) = ${at.h} kJ/mol, not ≈ 0`,
          ]);
        }
        dfH = '0';
        dfHNote = `reference state: zero by convention (polynomial gives ${Number(at.h.toPrecision(3))} kJ/mol)`;
      }
      const common = ['none', '', '', NASA_SOURCE_KEY, '', first.note, 'entered', '1', ionConvention];
      valueRows.push([sp.key, 'dfH298', dfH, 'kJ/mol', ...common, dfHNote]);
      valueRows.push([sp.key, 'S298', fixed4(at.s), 'J/(mol K)', ...common, fromText + below]);
    } else if (sp.first.referenceState !== undefined) {
      throw new NasaImportError([`label '${first.row.label}': reference state '${sp.key}' has no fit at 298.15 K`]);
    }

    modelLines.push(
      JSON.stringify({
        species: sp.key,
        source: NASA_SOURCE_KEY,
        entryNote: combinedEntryNote(sp.forms.map((f) => f.note)),
        provenance: 'entered',
        scale: 'formation',
        forms: sp.forms.map((f) => ({
          form: f.row.form ?? null,
          label: f.row.label,
          model: { kind: f.entry.kind, ranges: f.entry.ranges, coefficients: f.entry.coefficients },
        })),
      }),
    );
  }

  return {
    speciesCsv: toCsv(SPECIES_HEADER, speciesRows),
    valuesCsv: toCsv(VALUES_HEADER, valueRows),
    modelsJsonl: `${modelLines.join('\n')}\n`,
    sourceRecord: NASA_SOURCE_RECORD,
    counts: {
      species: species.length,
      values: valueRows.length,
      models: modelLines.length,
      excluded: exclusions.length,
    },
  };
}
