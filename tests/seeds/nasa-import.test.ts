/**
 * The NASA TM-4513 seed files against their source.
 *
 * Source of every expected number: B. J. McBride, S. Gordon and M. A. Reno, NASA TM-4513 (1993),
 * through the copied files seeds/source-data/nasa-tm4513/{gas,condensed}.jsonl. The NASA-7/9
 * equations are evaluated here from SOURCE.md, independently of scripts/library/nasa-polynomials.ts.
 */
import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { parseFormula, ratToNumber } from '@shared/chemistry';
import { NASA_EXCLUDED, NASA_LABELS, type NasaLabelRow } from '../../scripts/library/nasa-labels';
import {
  buildNasaSeed,
  NASA_SOURCE_RECORD,
  NasaImportError,
  readSourceJsonl,
  SOURCES_HEADER,
} from '../../scripts/library/nasa-seed';
import { splitCsvRecords, upsertCsvRecord } from '../../scripts/library/seed-csv';

const root = new URL('../../', import.meta.url);
const read = (path: string): string => readFileSync(new URL(path, root), 'utf8');

// ---- the source, read here without the import's reader -------------------------------------
interface RawEntry {
  name: string;
  composition: Record<string, number>;
  model: 'NASA7' | 'NASA9';
  ranges: number[];
  coefficients: number[][];
  note: string;
}
const rawLines = (file: string): RawEntry[] =>
  read(`seeds/source-data/nasa-tm4513/${file}`)
    .split('\n')
    .filter((l) => l.trim() !== '')
    .map((l) => JSON.parse(l) as RawEntry);
const rawGas = rawLines('gas.jsonl');
const rawCondensed = rawLines('condensed.jsonl');
const rawByLabel = new Map([...rawGas, ...rawCondensed].map((e) => [e.name, e]));

// ---- the committed seed files ---------------------------------------------------------------
type Row = Record<string, string>;
const csv = (path: string): Row[] => {
  const parsed = Papa.parse<Row>(read(path), { header: true, skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
};
const speciesRows = csv('seeds/library/species-nasa.csv');
const valueRows = csv('seeds/library/values-nasa.csv');
interface ModelLine {
  species: string;
  source: string;
  entryNote: string;
  provenance: string;
  scale: string;
  forms: {
    form: string | null;
    label: string;
    model: { kind: 'nasa7' | 'nasa9'; ranges: number[]; coefficients: number[][] };
  }[];
}
const models = read('seeds/library/models-nasa.jsonl')
  .split('\n')
  .filter((l) => l !== '')
  .map((l) => JSON.parse(l) as ModelLine);
const modelByKey = new Map(models.map((m) => [m.species, m]));
const value = (key: string, property: 'dfH298' | 'S298'): Row | undefined =>
  valueRows.find((v) => v.species === key && v.property === property);

// ---- NASA-7 and NASA-9 as printed in SOURCE.md (T in K, R = 8.314462618 J/(mol K)) ------------
const R = 8.314462618;
function enthalpyKJ(model: 'NASA7' | 'NASA9' | 'nasa7' | 'nasa9', a: number[], T: number): number {
  const c = (i: number): number => a[i] ?? Number.NaN;
  const hOverRT =
    model.toUpperCase() === 'NASA7'
      ? c(0) + (c(1) * T) / 2 + (c(2) * T * T) / 3 + (c(3) * T ** 3) / 4 + (c(4) * T ** 4) / 5 + c(5) / T
      : -c(0) / T ** 2 +
        (c(1) * Math.log(T)) / T +
        c(2) +
        (c(3) * T) / 2 +
        (c(4) * T * T) / 3 +
        (c(5) * T ** 3) / 4 +
        (c(6) * T ** 4) / 5 +
        c(7) / T;
  return (hOverRT * R * T) / 1000;
}
function entropyJ(model: 'NASA7' | 'NASA9' | 'nasa7' | 'nasa9', a: number[], T: number): number {
  const c = (i: number): number => a[i] ?? Number.NaN;
  const sOverR =
    model.toUpperCase() === 'NASA7'
      ? c(0) * Math.log(T) + c(1) * T + (c(2) * T * T) / 2 + (c(3) * T ** 3) / 3 + (c(4) * T ** 4) / 4 + c(6)
      : -c(0) / (2 * T * T) -
        c(1) / T +
        c(2) * Math.log(T) +
        c(3) * T +
        (c(4) * T * T) / 2 +
        (c(5) * T ** 3) / 3 +
        (c(6) * T ** 4) / 4 +
        c(8);
  return sOverR * R;
}
/** H and S at 298.15 K from the source entry itself (first range; 300-K fits used 1.85 K below). */
function at298(label: string): { h: number; s: number } {
  const e = rawByLabel.get(label);
  if (!e) throw new Error(`no source entry '${label}'`);
  return { h: enthalpyKJ(e.model, e.coefficients[0]!, 298.15), s: entropyJ(e.model, e.coefficients[0]!, 298.15) };
}
const firstLabel = (key: string): string => modelByKey.get(key)!.forms[0]!.label;

// Key combustion and process species, plus ions, allotropes and liquids: checked by name so a
// renamed or lost key fails here even if the full sweep below still passes.
const NAMED_SAMPLE = [
  'H2O(l)',
  'H2O(g)',
  'CO2(g)',
  'CO(g)',
  'CH4(g)',
  'O2(g)',
  'N2(g)',
  'H2(g)',
  'C(cr, graphite)',
  'NO(g)',
  'NO2(g)',
  'N2O(g)',
  'NH3(g)',
  'SO2(g)',
  'SO3(g)',
  'H2S(g)',
  'HCl(g)',
  'HF(g)',
  'C2H2(g, ethyne)',
  'C2H4(g)',
  'C2H6(g)',
  'C3H8(g)',
  'C4H10(g, butane)',
  'C4H10(g, 2-methylpropane)',
  'C2H6O(g, ethanol)',
  'C2H6O(g, dimethyl ether)',
  'CH3OH(g)',
  'C6H6(g)',
  'C6H6(l)',
  'C7H8(l)',
  'C8H18(l, octane)',
  'OH(g)',
  'H(g)',
  'O(g)',
  'N(g)',
  'Al2O3(cr)',
  'SiO2(cr, quartz)',
  'CaCO3(cr, calcite)',
  'CaO(cr)',
  'Fe2O3(cr)',
  'Fe3O4(cr)',
  'KOH(cr)',
  'NaCl(cr)',
  'H2SO4(l)',
  'TiO2(cr, rutile)',
  'Al^+(g)',
  'e^-(g)',
  'Cl^-(g)',
  'NH4^+(g)',
  'H3O^+(g)',
  'S(cr, rhombic)',
  'P(cr, white)',
  'Br2(l)',
  'Hg(l)',
  'I2(cr)',
  'CHN(g, hydrogen cyanide)',
];

describe('values-nasa.csv', () => {
  it.each(NAMED_SAMPLE)('%s: ΔfH° and S° at 298.15 K re-derived from the source polynomial', (key) => {
    // Expected: NASA TM-4513 via seeds/source-data/nasa-tm4513, evaluated by at298() above.
    const { h, s } = at298(firstLabel(key));
    const dfH = value(key, 'dfH298');
    const S = value(key, 'S298');
    expect(dfH, `${key} has a ΔfH°`).toBeDefined();
    expect(Math.abs(Number(dfH!.value) - h)).toBeLessThan(1e-3);
    expect(Math.abs(Number(S!.value) - s)).toBeLessThan(1e-3);
  });

  it('every value re-derives from its source entry within 1e-3', () => {
    // NASA TM-4513 via seeds/source-data/nasa-tm4513. Reference states are written as 0; their polynomials give |H| < 1e-6 kJ/mol.
    let checked = 0;
    for (const v of valueRows) {
      const { h, s } = at298(firstLabel(v.species!));
      const expected = v.property === 'dfH298' ? h : s;
      expect(Math.abs(Number(v.value) - expected), `${v.species} ${v.property}`).toBeLessThan(1e-3);
      checked++;
    }
    expect(checked).toBeGreaterThan(1800);
  });

  it('agrees with CODATA Key Values (1989) for species the report took from them', () => {
    // Cox, Wagman & Medvedev, CODATA Key Values for Thermodynamics (1989); values and ± from
    // memory. TM-4513 adopted these, so this checks our mapping and evaluation, not the data.
    const codata: [key: string, property: 'dfH298' | 'S298', value: number, plusMinus: number][] = [
      ['CO2(g)', 'dfH298', -393.51, 0.13],
      ['CO2(g)', 'S298', 213.785, 0.01],
      ['H2O(l)', 'dfH298', -285.83, 0.04],
      ['H2O(l)', 'S298', 69.95, 0.03],
      ['H2O(g)', 'dfH298', -241.826, 0.04],
      ['H2O(g)', 'S298', 188.835, 0.01],
      ['CO(g)', 'dfH298', -110.53, 0.17],
      ['O2(g)', 'S298', 205.152, 0.005],
      ['N2(g)', 'S298', 191.609, 0.004],
      ['H2(g)', 'S298', 130.68, 0.003],
      ['H(g)', 'dfH298', 217.998, 0.006],
      ['O(g)', 'dfH298', 249.18, 0.1],
      ['C(g)', 'dfH298', 716.68, 0.45],
      ['N(g)', 'dfH298', 472.68, 0.4],
      ['C(cr, graphite)', 'S298', 5.74, 0.1],
    ];
    for (const [key, property, expected, plusMinus] of codata) {
      expect(Math.abs(Number(value(key, property)!.value) - expected), `${key} ${property}`).toBeLessThanOrEqual(
        plusMinus,
      );
    }
  });

  it('writes gaseous ions on the thermal-electron convention, as the source is', () => {
    // The electron of the report: Cp = 5/2 R at every T and H°(298.15 K) = 0.
    const e = rawByLabel.get('Electron')!;
    expect(e.coefficients[0]!.slice(0, 5)).toEqual([2.5, 0, 0, 0, 0]);
    expect(Math.abs(enthalpyKJ('NASA7', e.coefficients[0]!, 298.15))).toBeLessThan(1e-9);
    // Na+: ΔfH°(Na+) − ΔfH°(Na, g) = IE(Na) + 5/2 RT on this convention (domain notes §1).
    // IE(Na) = 5.139 eV (from memory); 1 eV = 96.4853 kJ/mol.
    const gap = Number(value('Na^+(g)', 'dfH298')!.value) - Number(value('Na(g)', 'dfH298')!.value);
    expect(Math.abs(gap - (5.139 * 96.4853 + (2.5 * R * 298.15) / 1000))).toBeLessThan(0.2);
    for (const s of speciesRows.filter((r) => r.phase === 'g' && r.charge !== '0')) {
      const v = value(s.key!, 'dfH298');
      if (v) expect(v.ion_convention, s.key).toBe('thermal-electron');
    }
    for (const v of valueRows.filter((r) => !r.species!.includes('^'))) expect(v.ion_convention).toBe('');
  });

  it('gives no value where the fit does not reach 298.15 K, and never extrapolates', () => {
    for (const key of ['Al(l)', 'KOH(l)', 'H2O(cr)', 'Br2(cr)', 'Hg(cr)', 'Fe(l)', 'SiO2(l)']) {
      expect(value(key, 'dfH298'), key).toBeUndefined();
      expect(modelByKey.has(key), `${key} keeps its model`).toBe(true);
    }
    for (const v of valueRows) {
      const first = modelByKey.get(v.species!)!.forms[0]!.model.ranges;
      expect(first[0]!, v.species).toBeLessThanOrEqual(300);
      expect(first[first.length - 1]!, v.species).toBeGreaterThan(298.15);
    }
  });

  it('states what every row needs: unit, source, note, provenance, pressure', () => {
    for (const v of valueRows) {
      expect(v.unit).toBe(v.property === 'dfH298' ? 'kJ/mol' : 'J/(mol K)');
      expect(v.uncertainty_kind).toBe('none');
      expect(v.source).toBe('nasa-tm4513');
      expect(v.provenance).toBe('entered');
      expect(v.pressure_bar).toBe('1');
      expect(v.entry_note).not.toBe('');
      expect(v.value).toMatch(/^-?\d+(\.\d{4})?$/);
    }
  });
});

describe('species-nasa.csv', () => {
  it('every key parses with the equation core and matches the source composition and charge', () => {
    for (const s of speciesRows) {
      const parsed = parseFormula(s.key!);
      expect(parsed.warnings, s.key).toEqual([]);
      expect(parsed.formula).toBe(s.formula);
      expect(parsed.phase).toBe(s.phase);
      expect(parsed.descriptor ?? '').toBe(s.descriptor);
      expect(String(parsed.charge)).toBe(s.charge);
      for (const form of modelByKey.get(s.key!)!.forms) {
        const source = rawByLabel.get(form.label)!;
        // The source writes a cation's missing electron as E: -1.
        const { E = 0, ...atoms } = source.composition;
        const counts = Object.fromEntries(Object.entries(parsed.composition).map(([el, n]) => [el, ratToNumber(n)]));
        expect(counts, `${s.key} vs ${form.label}`).toEqual(atoms);
        expect(parsed.charge, `${s.key} vs ${form.label}`).toBe(0 - E);
      }
    }
  });

  it('has about 1,100 species, one model each, no mixtures, and accounts for every label', () => {
    expect(speciesRows.length).toBeGreaterThan(1050);
    expect(speciesRows.length).toBeLessThan(1130);
    expect(models.length).toBe(speciesRows.length);
    expect(new Set(speciesRows.map((s) => s.key)).size).toBe(speciesRows.length);
    const labelsInModels = models.flatMap((m) => m.forms.map((f) => f.label));
    expect(labelsInModels.some((l) => l.startsWith('Jet-A'))).toBe(false);
    const excluded = NASA_EXCLUDED.map((e) => e.label);
    expect(excluded).toEqual(expect.arrayContaining(['Jet-A(g)', 'Jet-A(L)']));
    expect([...labelsInModels, ...excluded].sort()).toEqual([...rawByLabel.keys()].sort());
  });

  it('marks one reference state for every element, each with ΔfH° exactly 0', () => {
    const refs = speciesRows.filter((s) => s.reference_state !== '');
    const byElement = new Map(refs.map((s) => [s.reference_state!, s.key!]));
    expect(byElement.size).toBe(refs.length);
    // The conventional reference states (domain notes §1; common practice).
    expect(Object.fromEntries(byElement)).toMatchObject({
      C: 'C(cr, graphite)',
      O: 'O2(g)',
      H: 'H2(g)',
      N: 'N2(g)',
      F: 'F2(g)',
      Cl: 'Cl2(g)',
      Br: 'Br2(l)',
      I: 'I2(cr)',
      Hg: 'Hg(l)',
      S: 'S(cr, rhombic)',
      P: 'P(cr, white)',
      Al: 'Al(cr)',
      Fe: 'Fe(cr)',
      Na: 'Na(cr)',
    });
    const elements = new Set(speciesRows.flatMap((s) => Object.keys(parseFormula(s.key!).composition)));
    for (const el of elements) expect(byElement.has(el), `reference state of ${el}`).toBe(true);
    for (const key of byElement.values()) {
      const v = value(key, 'dfH298')!;
      expect(v.value, key).toBe('0');
      expect(v.note).toMatch(/^reference state: zero by convention \(polynomial gives .+ kJ\/mol\)$/);
      expect(Math.abs(at298(firstLabel(key)).h)).toBeLessThan(0.005);
    }
  });

  it('gives every CAS RN a valid check digit', () => {
    // CAS check digit: Σ (position from the right × digit) mod 10 (CAS registry rules; common practice).
    const valid = (cas: string): boolean => {
      const m = /^(\d{2,7})-(\d{2})-(\d)$/.exec(cas);
      if (!m) return false;
      const digits = `${m[1]}${m[2]}`.split('').map(Number).reverse();
      return digits.reduce((sum, d, i) => sum + d * (i + 1), 0) % 10 === Number(m[3]);
    };
    expect(valid('7732-18-5')).toBe(true); // water, from memory
    expect(valid('7732-18-6')).toBe(false);
    const withCas = speciesRows.filter((s) => s.cas !== '');
    expect(withCas.length).toBeGreaterThan(200);
    for (const s of withCas) expect(valid(s.cas!), `${s.key} ${s.cas}`).toBe(true);
    for (const s of speciesRows) expect(`${s.inchi}${s.inchikey}`).toBe('');
  });

  it('names isomers with lower-case descriptors and keys the combustion species as expected', () => {
    const keys = new Set(speciesRows.map((s) => s.key));
    for (const key of NAMED_SAMPLE) expect(keys.has(key), key).toBe(true);
    for (const s of speciesRows.filter((r) => r.descriptor !== ''))
      expect(s.descriptor).toBe(s.descriptor!.toLowerCase());
    // A name is a chemical name, never one of the report's labels.
    for (const s of speciesRows) {
      expect(s.name, s.key).not.toBe('');
      for (const f of modelByKey.get(s.key!)!.forms) expect(s.name).not.toBe(f.label);
    }
  });
});

describe('models-nasa.jsonl', () => {
  it('keeps ranges and coefficients exactly as the source has them', () => {
    // NASA TM-4513 via seeds/source-data/nasa-tm4513: compared number for number.
    for (const m of models) {
      expect(m.source).toBe('nasa-tm4513');
      expect(m.scale).toBe('formation');
      expect(m.provenance).toBe('entered');
      for (const f of m.forms) {
        const e = rawByLabel.get(f.label)!;
        expect(f.model.kind).toBe(e.model.toLowerCase());
        expect(f.model.ranges).toEqual(e.ranges);
        expect(f.model.coefficients).toEqual(e.coefficients);
      }
    }
  });

  it('groups solids into one species whose forms join in temperature', () => {
    // NASA TM-4513 via seeds/source-data/nasa-tm4513 (SOURCE.md: KOH(a) 300–516 K, KOH(b) 516–679 K);
    // the form names are the brief's reading of the report's labels (Fe a/c/d = α/γ/δ).
    const koh = modelByKey.get('KOH(cr)')!;
    expect(koh.forms.map((f) => [f.form, f.label])).toEqual([
      ['α', 'KOH(a)'],
      ['β', 'KOH(b)'],
    ]);
    expect(modelByKey.get('Fe(cr)')!.forms.map((f) => f.form)).toEqual(['α', 'γ', 'δ']);
    expect(modelByKey.get('S(cr, rhombic)')!.forms.map((f) => f.label)).toEqual(['S(cr1)', 'S(cr2)']);
    expect(modelByKey.get('SiO2(cr, quartz)')!.forms.map((f) => f.label)).toEqual(['SiO2(Lqz)', 'SiO2(hqz)']);
    expect(modelByKey.get('PbO(cr, red)')!.forms.map((f) => f.form)).toEqual(['red', 'yellow']);
    let sequences = 0;
    for (const m of models) {
      if (m.forms.length > 1) sequences++;
      for (let i = 1; i < m.forms.length; i++) {
        const before = m.forms[i - 1]!.model.ranges;
        expect(m.forms[i]!.model.ranges[0], `${m.species} form ${i}`).toBe(before[before.length - 1]);
        expect(m.forms[i]!.form, `${m.species} form ${i}`).not.toBeNull();
      }
    }
    expect(sequences).toBeGreaterThan(40);
    // Gases and liquids have one form.
    for (const m of models.filter((x) => !x.species.includes('(cr'))) expect(m.forms).toHaveLength(1);
  });

  it('is continuous at every joint inside a fit except the two the source documents', () => {
    // SOURCE.md: ZnSO4(a) jumps about 5 kJ/mol at 540 K, Li2O(s) about 0.3 kJ/mol at 1000 K; every
    // other joint agrees within 0.1 kJ/mol.
    const jumps: string[] = [];
    let joints = 0;
    for (const m of models) {
      for (const f of m.forms) {
        const { kind, ranges, coefficients } = f.model;
        for (let i = 1; i < ranges.length - 1; i++) {
          const T = ranges[i]!;
          const jump = enthalpyKJ(kind, coefficients[i]!, T) - enthalpyKJ(kind, coefficients[i - 1]!, T);
          joints++;
          if (Math.abs(jump) > 0.1) jumps.push(`${f.label}@${T}:${Math.abs(jump).toFixed(1)}`);
        }
      }
    }
    expect(joints).toBeGreaterThan(800);
    expect(jumps.sort()).toEqual(['Li2O(s)@1000:0.3', 'ZnSO4(a)@540:5.0']);
  });
});

describe('buildNasaSeed', () => {
  const gas = readSourceJsonl(read('seeds/source-data/nasa-tm4513/gas.jsonl'), 'gas.jsonl');
  const condensed = readSourceJsonl(read('seeds/source-data/nasa-tm4513/condensed.jsonl'), 'condensed.jsonl');

  it('reproduces the committed files byte for byte, twice', () => {
    const first = buildNasaSeed(gas, condensed, NASA_LABELS, NASA_EXCLUDED);
    const second = buildNasaSeed(gas, condensed, NASA_LABELS, NASA_EXCLUDED);
    expect(second).toEqual(first);
    expect(first.speciesCsv).toBe(read('seeds/library/species-nasa.csv'));
    expect(first.valuesCsv).toBe(read('seeds/library/values-nasa.csv'));
    expect(first.modelsJsonl).toBe(read('seeds/library/models-nasa.jsonl'));
    const sources = Papa.parse<Row>(read('seeds/library/sources.csv'), { header: true, skipEmptyLines: true }).data;
    const ours = sources.find((r) => r.key === 'nasa-tm4513')!;
    expect(SOURCES_HEADER.map((h) => ours[h])).toEqual(NASA_SOURCE_RECORD);
  });

  const withRow = (label: string, change: Partial<NasaLabelRow>): NasaLabelRow[] =>
    NASA_LABELS.map((r) => (r.label === label ? { ...r, ...change } : r));
  const problemsOf = (run: () => unknown): string[] => {
    try {
      run();
    } catch (err) {
      expect(err).toBeInstanceOf(NasaImportError);
      return [...(err as NasaImportError).problems];
    }
    throw new Error('the import did not stop');
  };

  it('stops when a key disagrees with the source charge', () => {
    const problems = problemsOf(() => buildNasaSeed(gas, condensed, withRow('AL+', { formula: 'Al' }), NASA_EXCLUDED));
    expect(problems.join('\n')).toMatch(/label 'AL\+'.*charge 0, the source 1/);
  });

  it('stops when a key disagrees with the source composition', () => {
    const problems = problemsOf(() =>
      buildNasaSeed(gas, condensed, withRow('KOH(b)', { formula: 'NaOH' }), NASA_EXCLUDED),
    );
    expect(problems.join('\n')).toMatch(/label 'KOH\(b\)'.*composition H1 Na1 O1, the source H1 K1 O1/);
  });

  it('stops when a label is neither mapped nor excluded', () => {
    const problems = problemsOf(() =>
      buildNasaSeed(
        gas,
        condensed,
        NASA_LABELS.filter((r) => r.label !== 'CO2'),
        NASA_EXCLUDED,
      ),
    );
    expect(problems).toContain(
      "gas.jsonl line 176: label 'CO2' is neither mapped nor excluded in scripts/library/nasa-labels.ts",
    );
  });

  it('stops on the source Zn+ entry if it were mapped, which is why it is excluded', () => {
    const zinc = NASA_EXCLUDED.find((e) => e.label === 'Zn+')!;
    const rows: NasaLabelRow[] = [...NASA_LABELS, { label: 'Zn+', formula: 'Zn^+', phase: 'g', name: 'zinc(1+) ion' }];
    const problems = problemsOf(() =>
      buildNasaSeed(
        gas,
        condensed,
        rows,
        NASA_EXCLUDED.filter((e) => e !== zinc),
      ),
    );
    expect(problems.join('\n')).toMatch(/label 'Zn\+'.*charge 1, the source 0/);
    // And the reason holds: H(Zn+) − H(Zn) is the ionization energy without 5/2 RT.
    // IE(Zn) = 9.394 eV, from memory.
    const gap = at298('Zn+').h - at298('Zn').h;
    expect(Math.abs(gap - 9.394 * 96.4853)).toBeLessThan(0.1);
  });

  it('stops when solid forms do not join', () => {
    const moved = condensed.map((e) => (e.label === 'KOH(b)' ? { ...e, ranges: [520, 679] } : e));
    const problems = problemsOf(() => buildNasaSeed(gas, moved, NASA_LABELS, NASA_EXCLUDED));
    expect(problems.join('\n')).toMatch(/KOH\(a\) ends at 516 K, KOH\(b\) starts at 520 K/);
  });

  it('names the file and line of a source line it cannot read', () => {
    expect(() => readSourceJsonl('{"name": "X"}\n', 'gas.jsonl')).toThrow(/gas\.jsonl line 1: field 'composition'/);
  });
});

describe('upsertCsvRecord', () => {
  it('replaces only its own record and keeps every other record byte for byte', () => {
    const header = [...SOURCES_HEADER];
    const other = 'codata-1989,compilation,"Cox, J. D.",CODATA Key Values,,1989,,,,,,"two\nlines, ""quoted"""';
    const before = `${header.join(',')}\n${other}\nnasa-tm4513,report,old,,,,,,,,,\n`;
    const after = upsertCsvRecord(before, header, NASA_SOURCE_RECORD);
    const records = splitCsvRecords(after);
    expect(records[1]).toBe(other);
    expect(records).toHaveLength(3);
    expect(upsertCsvRecord(after, header, NASA_SOURCE_RECORD)).toBe(after);
    expect(splitCsvRecords(upsertCsvRecord(null, header, NASA_SOURCE_RECORD))).toHaveLength(2);
  });
});
