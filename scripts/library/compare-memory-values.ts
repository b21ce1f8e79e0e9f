/**
 * Compares the library's reference values (values-*.csv other than the NASA import) with H°(298.15 K)
 * and S°(298.15 K) evaluated directly from the NASA TM-4513 polynomial file, and — where the NASA
 * file does not hold a species — with the same property from another of our sources.
 *
 * Purpose: catch typing and memory errors in values typed from memory, and produce the comparison
 * wording of each row's `note`. For many key species the NASA report adopted the CODATA Key Values,
 * so agreement there confirms the typing, not the measurement.
 *
 * Usage: npx tsx scripts/library/compare-memory-values.ts [--json] [--only-disagreements] [--library DIR]
 */
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import Papa from 'papaparse';
import { NASA_SOURCE_DIR } from './import-nasa';
import { loadNasaEntries, nasaLabelsByKey, nasaEntryFor, PROVISIONAL_NASA_LABELS } from './nasa-key-map';
import { evaluateAtReference } from './nasa-polynomials';

interface ValueRow {
  species: string;
  property: string;
  value: string;
  unit: string;
  uncertainty_kind: string;
  uncertainty: string;
  source: string;
  file: string;
  line: number;
}

export interface Comparison {
  species: string;
  property: 'dfH298' | 'S298';
  source: string;
  file: string;
  line: number;
  value: number;
  kind: string;
  uncertainty: number | null;
  comparedWith: string | null;
  reference: number | null;
  referenceLabel: string | null;
  difference: number | null;
  verdict: 'agrees' | 'differs' | 'compared' | 'unchecked';
  note: string;
}

const NASA_SOURCE = 'nasa-tm4513';

function readValueFiles(libraryDir: string): ValueRow[] {
  const rows: ValueRow[] = [];
  const files = readdirSync(libraryDir)
    .filter((f) => /^values-.*\.csv$/.test(f) && f !== 'values-nasa.csv')
    .sort();
  for (const file of files) {
    const parsed = Papa.parse<Record<string, string>>(readFileSync(join(libraryDir, file), 'utf8'), {
      header: true,
      skipEmptyLines: true,
    });
    if (parsed.errors.length > 0) {
      const e = parsed.errors[0]!;
      throw new Error(`${file} row ${(e.row ?? 0) + 2}: ${e.message}`);
    }
    parsed.data.forEach((r, i) => {
      rows.push({
        species: r.species ?? '',
        property: r.property ?? '',
        value: r.value ?? '',
        unit: r.unit ?? '',
        uncertainty_kind: r.uncertainty_kind ?? '',
        uncertainty: r.uncertainty ?? '',
        source: r.source ?? '',
        file,
        line: i + 2,
      });
    });
  }
  return rows;
}

/** |x| rounded up to the shown precision, never shown as 0. */
function within(x: number): string {
  return Math.max(0.01, Math.ceil(Math.abs(x) * 100 - 1e-9) / 100).toFixed(2);
}

function signed(x: number): string {
  const r = Math.round(x * 100) / 100;
  return `${r >= 0 ? '+' : '−'}${Math.abs(r).toFixed(2)}`;
}

/** |x| rounded to the shown precision. */
function magnitude(x: number): string {
  return (Math.round(Math.abs(x) * 100) / 100).toFixed(2);
}

function describe(
  property: string,
  against: string,
  diff: number,
  uText: string,
): { verdict: Comparison['verdict']; note: string } {
  const unit = property === 'dfH298' ? 'kJ/mol' : 'J/(mol K)';
  const u = uText === '' ? null : Number(uText);
  if (u !== null && u > 0) {
    if (Math.abs(diff) <= u + 1e-9)
      return { verdict: 'agrees', note: `agrees with ${against} within ${within(diff)} ${unit}` };
    return {
      verdict: 'differs',
      note: `differs from ${against} by ${magnitude(diff)} ${unit} (this value ${signed(diff)}), beyond its ± ${uText}`,
    };
  }
  if (Math.abs(diff) < 0.005) return { verdict: 'agrees', note: `agrees with ${against} within 0.01 ${unit}` };
  return {
    verdict: 'compared',
    note: `differs from ${against} by ${magnitude(diff)} ${unit} (this value ${signed(diff)}; no ± stated to judge it)`,
  };
}

/** Every comparison for the value rows of a library folder. */
export function compareLibrary(libraryDir: string): { comparisons: Comparison[]; labelOrigin: string } {
  const rows = readValueFiles(libraryDir);
  const entries = loadNasaEntries();
  const { labels, origin } = nasaLabelsByKey(libraryDir);
  const comparisons: Comparison[] = [];
  for (const row of rows) {
    if (row.property !== 'dfH298' && row.property !== 'S298') continue;
    const value = Number(row.value);
    const u = row.uncertainty === '' ? null : Number(row.uncertainty);
    const base = {
      species: row.species,
      property: row.property,
      source: row.source,
      file: row.file,
      line: row.line,
      value,
      kind: row.uncertainty_kind,
      uncertainty: u,
    } as const;
    const entry = nasaEntryFor(row.species, labels, entries);
    if (entry) {
      const { h, s } = evaluateAtReference(entry);
      const reference = row.property === 'dfH298' ? h : s;
      const diff = value - reference;
      const verdict = describe(row.property, NASA_SOURCE, diff, row.uncertainty);
      // Name the entry and the data behind its fit (J = JANAF, CODA89 = CODATA…) where the two differ.
      const note =
        verdict.verdict === 'agrees' ? verdict.note : `${verdict.note} (NASA entry ${entry.label}, ${entry.note})`;
      comparisons.push({
        ...base,
        comparedWith: NASA_SOURCE,
        reference,
        referenceLabel: entry.label,
        difference: diff,
        verdict: verdict.verdict,
        note,
      });
      continue;
    }
    // No NASA entry: compare with the same property from our other sources, CODATA first.
    const others = rows
      .filter((o) => o !== row && o.species === row.species && o.property === row.property && o.source !== row.source)
      .sort((a, b) =>
        a.source === 'codata-1989' ? -1 : b.source === 'codata-1989' ? 1 : a.source.localeCompare(b.source),
      );
    const other = others[0];
    if (other) {
      const reference = Number(other.value);
      const diff = value - reference;
      comparisons.push({
        ...base,
        comparedWith: other.source,
        reference,
        referenceLabel: null,
        difference: diff,
        ...describe(row.property, other.source, diff, row.uncertainty),
      });
      continue;
    }
    comparisons.push({
      ...base,
      comparedWith: null,
      reference: null,
      referenceLabel: null,
      difference: null,
      verdict: 'unchecked',
      note: 'no second source available',
    });
  }
  return { comparisons, labelOrigin: origin };
}

function pad(text: string, width: number): string {
  return text.length >= width ? text : text + ' '.repeat(width - text.length);
}

function main(): void {
  const args = process.argv.slice(2);
  const libIndex = args.indexOf('--library');
  const libraryDir = resolve(libIndex >= 0 ? args[libIndex + 1]! : 'seeds/library');
  if (!existsSync(libraryDir)) throw new Error(`library folder not found: ${libraryDir}`);
  const { comparisons, labelOrigin } = compareLibrary(libraryDir);
  const shown = args.includes('--only-disagreements')
    ? comparisons.filter((c) => c.verdict === 'differs')
    : comparisons;
  if (args.includes('--json')) {
    process.stdout.write(JSON.stringify(shown, null, 1) + '\n');
    return;
  }
  console.log(`NASA data: ${NASA_SOURCE_DIR}  (key → label map: ${labelOrigin})`);
  console.log(
    [
      pad('species', 34),
      pad('prop', 6),
      pad('source', 16),
      pad('value', 11),
      pad('±', 7),
      pad('reference', 12),
      pad('diff', 9),
      'verdict (against)',
    ].join(' '),
  );
  for (const c of shown) {
    console.log(
      [
        pad(c.species, 34),
        pad(c.property, 6),
        pad(c.source, 16),
        pad(String(c.value), 11),
        pad(c.uncertainty === null ? '—' : String(c.uncertainty), 7),
        pad(c.reference === null ? '—' : c.reference.toFixed(4), 12),
        pad(c.difference === null ? '—' : signed(c.difference), 9),
        `${c.verdict}${c.comparedWith ? ` (${c.comparedWith}${c.referenceLabel ? `: ${c.referenceLabel}` : ''})` : ''}`,
      ].join(' '),
    );
  }
  const count = (v: Comparison['verdict']) => comparisons.filter((c) => c.verdict === v).length;
  console.log(
    `\n${comparisons.length} values: ${count('agrees')} agree, ${count('differs')} differ beyond their ±, ` +
      `${count('compared')} compared without a ±, ${count('unchecked')} without a second source.`,
  );
  const provisional = Object.keys(PROVISIONAL_NASA_LABELS).length;
  if (labelOrigin === 'provisional')
    console.log(`(${provisional} provisional keys for NASA species: reconcile with the NASA import.)`);
}

if (process.argv[1] && resolve(process.argv[1]) === resolve(new URL(import.meta.url).pathname)) main();
