/**
 * Closure of the measured reactions (seeds/library/reactions-*.csv) against the library's selected
 * formation enthalpies: for each reaction, ΔrH as recorded minus Σν ΔfH°(selected), with the
 * combined uncertainty. A curator's aid when adding or reviewing reactions; the tests in
 * tests/seeds/reactions.test.ts check the same closures with their own code.
 *
 * - Selected ΔfH°: the row of selections.csv, or the only candidate of the values files.
 * - Standard uncertainties from the stated ones as FORMAT.md reads them (two-sigma and interval: ±/2,
 *   expanded: U/k). Where none is stated: a formation enthalpy counts ±0.8 kJ/mol (u = 0.4; the NBS
 *   tables' own bound of 80 units of the last digit at 0.01 kJ/mol); a reaction counts half the last
 *   printed digit, except the sources in NONE_STATED_U that state a ± the file does not carry.
 * - A reaction at T ≠ 298.15 K is compared with Σν ΔfH° taken to T with the NASA TM-4513 polynomials
 *   of models-nasa.jsonl (H(T) − H(298.15 K) of each species).
 * - Reactions at a finite molality are skipped: their aqueous species are not the library's.
 *
 * Usage: npx tsx scripts/library/reaction-closures.ts [--phrases] [--library DIR]
 *   default: a table; --phrases: JSON {reaction key: comparison sentence} for the rows' notes.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { parseEquation, ratText } from '@shared/chemistry';

type Row = Record<string, string>;
const R = 8.314462618e-3; // kJ/(mol K), CODATA 2018
const T_REF = 298.15;

/** Standard uncertainty (kJ/mol) of a reaction whose file row states none, by source. */
export const NONE_STATED_U: Record<string, number> = {
  // The papers state about ±0.05–0.1 kcal/mol per reaction (from memory); 0.2 kJ/mol is u for ±0.1 kcal at 2u.
  'kistiakowsky-1935a': 0.2,
  'kistiakowsky-1935b': 0.2,
  'kistiakowsky-1936': 0.2,
  // Recommended sublimation enthalpies with ± of about 0.6–1 kJ/mol (from memory), not entered.
  'sabbah-1999': 0.5,
};
/** Standard uncertainty (kJ/mol) of a selected ΔfH° that states none (NASA TM-4513, NBS 1982, CRC). */
export const NONE_STATED_FORMATION_U = 0.4;

function readCsv(dir: string, file: string): Row[] {
  const parsed = Papa.parse<Row>(readFileSync(join(dir, file), 'utf8'), { header: true, skipEmptyLines: true });
  if (parsed.errors.length > 0) throw new Error(`${file}: ${parsed.errors[0]!.message}`);
  return parsed.data;
}

function statedU(kind: string, value: string, k: string): number | null {
  if (kind === 'none' || value === '') return null;
  const v = Number(value);
  if (kind === 'standard') return v;
  if (kind === 'expanded') return v / Number(k);
  return v / 2; // two-sigma, interval
}

const halfLastDigit = (text: string): number => 0.5 * 10 ** -(text.split('.')[1]?.length ?? 0);

interface Nasa7 {
  ranges: number[];
  coefficients: number[][];
}

/** H(T) in kJ/mol from a NASA-7 fit (formation scale). */
function nasaH(model: Nasa7, T: number): number {
  const i = model.ranges.findIndex((_, j) => j > 0 && T <= model.ranges[j]!) - 1;
  if (i < 0 || T < model.ranges[0]!) throw new Error(`T = ${T} K outside the fit`);
  const [a1, a2, a3, a4, a5, a6] = model.coefficients[i]! as [number, number, number, number, number, number];
  return R * T * (a1 + (a2 * T) / 2 + (a3 * T ** 2) / 3 + (a4 * T ** 3) / 4 + (a5 * T ** 4) / 5 + a6 / T);
}

export interface Closure {
  key: string;
  file: string;
  deltaH: number;
  temperature: number;
  /** Σν ΔfH° (selected), taken to `temperature` when it is not 298.15 K. */
  predicted: number;
  /** deltaH − predicted. */
  difference: number;
  /** Combined expanded uncertainty, 2·√(Σ(ν u)² + u_r²). */
  combined: number;
  closes: boolean;
  /** Species → source of the selected ΔfH° (reference states with ΔfH° = 0 left out). */
  sources: Map<string, string>;
}

export function reactionClosures(dir: string): { closures: Closure[]; skipped: string[] } {
  const files = readdirSync(dir).sort();
  const values = files.filter((f) => /^values-.*\.csv$/.test(f)).flatMap((f) => readCsv(dir, f));
  const selections = readCsv(dir, 'selections.csv');
  const referenceStates = new Set(
    files
      .filter((f) => /^species-.*\.csv$/.test(f))
      .flatMap((f) => readCsv(dir, f))
      .filter((s) => s.reference_state !== '')
      .map((s) => s.key!),
  );
  const models = new Map<string, Nasa7>();
  for (const line of readFileSync(join(dir, 'models-nasa.jsonl'), 'utf8').split('\n')) {
    if (line.trim() === '') continue;
    const m = JSON.parse(line) as { species: string; forms: { model: Nasa7 & { kind: string } }[] };
    if (m.forms.length === 1 && m.forms[0]!.model.kind === 'nasa7') models.set(m.species, m.forms[0]!.model);
  }
  const selected = (species: string): { value: number; u: number; source: string } | null => {
    const candidates = values.filter(
      (v) => v.species === species && v.property === 'dfH298' && v.provenance !== 'superseded',
    );
    const chosen = selections.find((s) => s.species === species && s.property === 'dfH298')?.source;
    const row = chosen
      ? candidates.find((c) => c.source === chosen)
      : candidates.length === 1
        ? candidates[0]
        : undefined;
    if (!row) return null;
    const u = statedU(row.uncertainty_kind!, row.uncertainty!, row.k!);
    const exactZero = Number(row.value) === 0 && referenceStates.has(species);
    return { value: Number(row.value), u: exactZero ? 0 : (u ?? NONE_STATED_FORMATION_U), source: row.source! };
  };

  const closures: Closure[] = [];
  const skipped: string[] = [];
  for (const file of files.filter((f) => /^reactions-.*\.csv$/.test(f))) {
    for (const r of readCsv(dir, file)) {
      if (r.molality !== '') {
        skipped.push(`${r.key}: finite molality`);
        continue;
      }
      const T = Number(r.temperature);
      let predicted = 0;
      let variance = 0;
      const sources = new Map<string, string>();
      let missing = '';
      for (const t of parseEquation(r.equation!).terms) {
        const s = t.species;
        const key = `${s.formula}(${s.phase}${s.descriptor ? `, ${s.descriptor}` : ''})`;
        const [n, d = '1'] = ratText(t.coefficient).split('/');
        const nu = ((t.side === 'product' ? 1 : -1) * Number(n)) / Number(d);
        const v = selected(key);
        if (!v) {
          missing = key;
          break;
        }
        predicted += nu * v.value;
        variance += (nu * v.u) ** 2;
        if (!(v.value === 0 && referenceStates.has(key))) sources.set(key, v.source);
        if (Math.abs(T - T_REF) > 1e-9) {
          const model = models.get(key);
          if (!model) {
            missing = `${key} (no NASA polynomial for T = ${T} K)`;
            break;
          }
          predicted += nu * (nasaH(model, T) - nasaH(model, T_REF));
        }
      }
      if (missing) {
        skipped.push(`${r.key}: no selected ΔfH° for ${missing}`);
        continue;
      }
      const ur =
        statedU(r.uncertainty_kind!, r.uncertainty!, r.k!) ?? NONE_STATED_U[r.source!] ?? halfLastDigit(r.delta_h!);
      const deltaH = Number(r.delta_h);
      const combined = 2 * Math.sqrt(variance + ur ** 2);
      const difference = deltaH - predicted;
      closures.push({
        key: r.key!,
        file,
        deltaH,
        temperature: T,
        predicted,
        difference,
        combined,
        closes: Math.abs(difference) <= combined,
        sources,
      });
    }
  }
  return { closures, skipped };
}

const fmt = (x: number, d = 2): string => x.toFixed(d).replace('-', '−');

/** The comparison sentence written into a reaction's note. */
export function closurePhrase(c: Closure): string {
  const bySource = new Map<string, string[]>();
  for (const [species, source] of c.sources) bySource.set(source, [...(bySource.get(source) ?? []), species]);
  const used = [...bySource].map(([source, species]) => `${species.join(', ')} ${source}`).join('; ');
  const at = c.temperature === T_REF ? '' : ` taken to ${c.temperature} K with the NASA TM-4513 polynomials`;
  const verdict = c.closes
    ? `agrees within ${fmt(Math.abs(c.difference))} kJ/mol (combined ± ${fmt(c.combined)}, 2u)`
    : `differs by ${fmt(Math.abs(c.difference))} kJ/mol (this value ${c.difference < 0 ? '−' : '+'}${fmt(Math.abs(c.difference))}), beyond the combined ± ${fmt(c.combined)} (2u)`;
  return `Compared with the library's selected ΔfH° (${used})${at}: Σν ΔfH° = ${fmt(c.predicted)} kJ/mol; ${verdict}.`;
}

function main(): void {
  const args = process.argv.slice(2);
  const libIndex = args.indexOf('--library');
  const dir = libIndex >= 0 ? args[libIndex + 1]! : fileURLToPath(new URL('../../seeds/library/', import.meta.url));
  const { closures, skipped } = reactionClosures(dir);
  if (args.includes('--phrases')) {
    console.log(JSON.stringify(Object.fromEntries(closures.map((c) => [c.key, closurePhrase(c)])), null, 1));
    return;
  }
  for (const c of closures)
    console.log(
      [
        c.closes ? 'ok  ' : 'OPEN',
        c.key.padEnd(44),
        fmt(c.deltaH).padStart(10),
        fmt(c.predicted).padStart(10),
        fmt(c.difference).padStart(7),
        `± ${fmt(c.combined)}`,
      ].join(' '),
    );
  for (const s of skipped) console.log(`skip ${s}`);
  const open = closures.filter((c) => !c.closes).length;
  console.log(`${closures.length} compared, ${open} beyond their combined uncertainty, ${skipped.length} skipped`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) main();
