/**
 * seeds/library/selections.csv and disagreements.csv against the rules of
 * scripts/library/select-values.ts.
 *
 * Expected NASA values are evaluated here from the published file itself
 * (seeds/source-data/nasa-tm4513/*.jsonl, NASA-7 equations of its SOURCE.md), independently of
 * scripts/library/nasa-polynomials.ts and of values-nasa.csv. Candidate values are read here from the
 * CSV files with papaparse, independently of the script's reader. CODATA and Pedley figures quoted
 * beside the checks are from memory, as in the files.
 */
import { readdirSync, readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import {
  disagreementsCsv,
  readLibraryCandidates,
  SelectionError,
  selectionsCsv,
  selectValues,
  type ModelCandidate,
  type ValueCandidate,
} from '../../scripts/library/select-values';

const root = new URL('../../', import.meta.url);
const read = (path: string): string => readFileSync(new URL(path, root), 'utf8');
type Row = Record<string, string>;
const csv = (path: string): Row[] => {
  const parsed = Papa.parse<Row>(read(path), { header: true, skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
};

const libraryFiles = readdirSync(new URL('seeds/library/', root)).sort();
const valueRows = libraryFiles.filter((f) => /^values-.*\.csv$/.test(f)).flatMap((f) => csv(`seeds/library/${f}`));
const modelLines = libraryFiles
  .filter((f) => /^models-.*\.jsonl$/.test(f))
  .flatMap((f) => read(`seeds/library/${f}`).split('\n'))
  .filter((l) => l.trim() !== '')
  .map((l) => JSON.parse(l) as { species: string; source: string; provenance: string });
const selections = csv('seeds/library/selections.csv');
const disagreements = csv('seeds/library/disagreements.csv');
const selectionOf = (species: string, property: string): Row | undefined =>
  selections.find((s) => s.species === species && s.property === property);
const candidate = (species: string, property: string, source: string): Row | undefined =>
  valueRows.find((v) => v.species === species && v.property === property && v.source === source);

// ---- H°(298.15 K) from the published NASA file (SOURCE.md: NASA-7, R = 8.314462618 J/(mol K)) -----
const rawEntries = new Map(
  ['gas.jsonl', 'condensed.jsonl']
    .flatMap((f) => read(`seeds/source-data/nasa-tm4513/${f}`).split('\n'))
    .filter((l) => l.trim() !== '')
    .map((l) => JSON.parse(l) as { name: string; model: string; ranges: number[]; coefficients: number[][] })
    .map((e) => [e.name, e]),
);
function nasaEnthalpy298(label: string): number {
  const e = rawEntries.get(label)!;
  expect(e.model).toBe('NASA7');
  expect(e.ranges[0]).toBeLessThanOrEqual(300);
  const [a1, a2, a3, a4, a5, a6] = e.coefficients[0]! as [number, number, number, number, number, number];
  const T = 298.15;
  const hOverRT = a1 + (a2 * T) / 2 + (a3 * T ** 2) / 3 + (a4 * T ** 3) / 4 + (a5 * T ** 4) / 5 + a6 / T;
  return (hOverRT * 8.314462618 * T) / 1000;
}

describe('selections.csv', () => {
  it('is what select-values.ts writes from the seed files, byte for byte, every time', () => {
    const { values, models } = readLibraryCandidates();
    const first = selectValues(values, models);
    expect(selectValues(values, models)).toEqual(first);
    expect(selectionsCsv(first)).toBe(read('seeds/library/selections.csv'));
    expect(disagreementsCsv(first)).toBe(read('seeds/library/disagreements.csv'));
  });

  it('selects every property with several candidates exactly once, and nothing else', () => {
    const candidates = new Map<string, Set<string>>();
    const add = (id: string, source: string) => candidates.set(id, (candidates.get(id) ?? new Set()).add(source));
    for (const v of valueRows) if (v.provenance !== 'superseded') add(`${v.species}|${v.property}`, v.source!);
    for (const m of modelLines) if (m.provenance !== 'superseded') add(`${m.species}|cp`, m.source);
    const expected = [...candidates].filter(([, sources]) => sources.size > 1).map(([id]) => id);
    const ids = selections.map((s) => `${s.species}|${s.property}`);
    expect(new Set(ids).size).toBe(ids.length);
    expect([...ids].sort()).toEqual(expected.sort());
    for (const s of selections) {
      expect(candidates.get(`${s.species}|${s.property}`)!.has(s.source!), `${s.species} ${s.property}`).toBe(true);
      expect(s.reason!.length, `${s.species} ${s.property}`).toBeGreaterThan(40);
    }
    expect(selections.length).toBeGreaterThan(400);
  });

  it('has the FORMAT.md header and is sorted by species, then property', () => {
    expect(read('seeds/library/selections.csv').split('\n')[0]).toBe('species,property,source,reason');
    const keys = selections.map((s) => [s.species!, s.property!] as const);
    const sorted = [...keys].sort((a, b) =>
      a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : a[1] < b[1] ? -1 : a[1] > b[1] ? 1 : 0,
    );
    expect(keys).toEqual(sorted);
  });

  it('H2O(l) ΔfH°: CODATA −285.830 ± 0.040 agrees with the NASA file, so CODATA is selected', () => {
    // CODATA Key Values 1989: −285.830 ± 0.040 kJ/mol (from memory); NASA TM-4513 entry H2O(L).
    const codata = candidate('H2O(l)', 'dfH298', 'codata-1989')!;
    expect([codata.value, codata.uncertainty]).toEqual(['-285.830', '0.040']);
    const nasa = nasaEnthalpy298('H2O(L)');
    expect(Math.abs(-285.83 - nasa)).toBeLessThanOrEqual(0.04);
    const row = selectionOf('H2O(l)', 'dfH298')!;
    expect(row.source).toBe('codata-1989');
    expect(row.reason).toMatch(
      /CODATA 1989 Key Value \(typed from memory\), agrees with NASA TM-4513 within its ± 0\.040 kJ\/mol/,
    );
  });

  it('HF(g) ΔfH°: CODATA −273.30 ± 0.70 is 0.75 kJ/mol from the NASA file, so the NASA value is kept and flagged', () => {
    // CODATA 1989: −273.30 ± 0.70 kJ/mol (from memory); NASA TM-4513 entry HF (J 6/77).
    const nasa = nasaEnthalpy298('HF');
    expect(Math.abs(-273.3 - nasa)).toBeGreaterThan(0.7);
    const row = selectionOf('HF(g)', 'dfH298')!;
    expect(row.source).toBe('nasa-tm4513');
    expect(row.reason).toMatch(
      /CODATA 1989 Key Value differs by 0\.75 kJ\/mol, beyond its ± 0\.70: the published file's value is kept; flagged for a curator/,
    );
    const flagged = disagreements.find((d) => d.species === 'HF(g)' && d.property === 'dfH298')!;
    expect(flagged).toMatchObject({
      selected_source: 'nasa-tm4513',
      other_source: 'codata-1989',
      stated_uncertainty: '0.70',
    });
    // values-nasa.csv keeps 4 decimals, hence the 1e-4.
    expect(Math.abs(Number(flagged.difference) - (-273.3 - nasa))).toBeLessThan(1e-4);
  });

  it('B(g) ΔfH°: CODATA 565 ± 5 lies just over 5 kJ/mol from the NASA file; the boundary is judged on the decimals', () => {
    // CODATA 1989: 565 ± 5 kJ/mol (from memory); NASA TM-4513 entry B (J 6/83).
    const nasa = nasaEnthalpy298('B');
    expect(565 - nasa).toBeGreaterThan(5);
    expect(565 - nasa).toBeLessThan(5.01);
    expect(selectionOf('B(g)', 'dfH298')!.source).toBe('nasa-tm4513');
    expect(selectionOf('B(g)', 'dfH298')!.reason).toMatch(/differs by 5\.003 kJ\/mol, beyond its ± 5:/);
  });

  it('ethanol gas: Pedley −234.8 ± 0.3 (2σ) agrees with the NASA file and is selected; methanol gas does not', () => {
    // Pedley 1986 (from memory): ethanol(g) −234.8 ± 0.3, methanol(g) −201.5 ± 0.3 kJ/mol.
    expect(Math.abs(-234.8 - nasaEnthalpy298('C2H5OH'))).toBeLessThanOrEqual(0.3);
    expect(selectionOf('C2H6O(g, ethanol)', 'dfH298')!.source).toBe('pedley-1986');
    expect(selectionOf('C2H6O(g, ethanol)', 'dfH298')!.reason).toMatch(/within its ± 0\.3 kJ\/mol \(2σ\)/);
    expect(Math.abs(-201.5 - nasaEnthalpy298('CH3OH'))).toBeGreaterThan(0.3);
    expect(selectionOf('CH3OH(g)', 'dfH298')!.source).toBe('nasa-tm4513');
  });

  it('keeps the NASA value where no other candidate states an uncertainty (NBS 1982 only)', () => {
    expect(candidate('NaCl(cr)', 'dfH298', 'nbs-1982')).toBeDefined();
    expect(candidate('NaCl(cr)', 'dfH298', 'codata-1989')).toBeUndefined();
    expect(selectionOf('NaCl(cr)', 'dfH298')!.source).toBe('nasa-tm4513');
  });

  it('without a NASA value prefers CODATA, then Pedley, then NBS 1982 over the CRC Handbook', () => {
    // I⁻(aq): CODATA −56.78 ± 0.05 against NBS −55.19 (both from memory); no NASA entry for aqueous ions.
    expect(selectionOf('I^-(aq)', 'dfH298')!.source).toBe('codata-1989');
    expect(selectionOf('I^-(aq)', 'dfH298')!.reason).toMatch(/the NASA file lacks this value/);
    expect(selectionOf('CH3OH(l)', 'dfH298')!.source).toBe('pedley-1986');
    expect(selectionOf('C2H6O(l)', 'S298')!.source).toBe('nbs-1982');
    expect(candidate('C2H6O(l)', 'S298', 'crc-handbook-97')).toBeDefined();
  });
});

describe('disagreements.csv', () => {
  it('lists exactly the candidates whose stated ± does not reach the selected value', () => {
    // Recomputed here from the CSV values. Apart from exact equalities (0 = 0 ± 0), no gap lies within
    // 1e-9 of its ±, so floating point decides safely.
    const expected: string[] = [];
    for (const s of selections.filter((r) => r.property !== 'cp')) {
      const selected = Number(candidate(s.species!, s.property!, s.source!)!.value);
      for (const c of valueRows.filter((v) => v.species === s.species && v.property === s.property)) {
        if (c.source === s.source || c.uncertainty === '' || c.provenance === 'superseded') continue;
        const gap = Math.abs(Number(c.value) - selected);
        if (gap !== 0) expect(Math.abs(gap - Number(c.uncertainty)), `${s.species} ${c.source}`).toBeGreaterThan(1e-9);
        if (gap > Number(c.uncertainty)) expected.push(`${s.species}|${s.property}|${c.source}`);
      }
    }
    expect(disagreements.map((d) => `${d.species}|${d.property}|${d.other_source}`).sort()).toEqual(expected.sort());
    expect(read('seeds/library/disagreements.csv').split('\n')[0]).toBe(
      'species,property,selected_source,other_source,difference,stated_uncertainty',
    );
    for (const d of disagreements) {
      const other = Number(candidate(d.species!, d.property!, d.other_source!)!.value);
      const kept = Number(candidate(d.species!, d.property!, d.selected_source!)!.value);
      expect(Math.abs(Number(d.difference) - (other - kept))).toBeLessThan(1e-9);
      expect(selectionOf(d.species!, d.property!)!.reason).toMatch(/flagged for a curator/);
    }
  });

  it('includes the disagreements the reference-value tests know about', () => {
    // tests/seeds/reference-values.test.ts, KNOWN_DISAGREEMENTS (CODATA against NASA TM-4513).
    const ids = new Set(disagreements.map((d) => `${d.species}|${d.property}`));
    for (const id of [
      'HF(g)|dfH298',
      'HI(g)|dfH298',
      'S(g)|dfH298',
      'CuSO4(cr)|dfH298',
      'MgO(cr)|dfH298',
      'Ca(cr)|S298',
    ])
      expect(ids.has(id), id).toBe(true);
  });
});

describe('selectValues', () => {
  const value = (source: string, v: string, u = '', provenance = 'memory'): ValueCandidate => ({
    species: 'X(g)',
    property: 'dfH298',
    value: v,
    uncertaintyKind: u === '' ? 'none' : source === 'pedley-1986' ? 'two-sigma' : 'interval',
    uncertainty: u,
    source,
    provenance,
  });
  const nasa = (v: string) => value('nasa-tm4513', v, '', 'entered');
  const model = (source: string, start: number, end: number, scale: ModelCandidate['scale']): ModelCandidate => ({
    species: 'X(g)',
    source,
    provenance: source === 'nasa-tm4513' ? 'entered' : 'memory',
    scale,
    start,
    end,
    kinds: [scale === 'formation' ? 'nasa7' : 'constant'],
  });

  it('judges agreement on the decimals as written, not in binary floating point', () => {
    // |−0.1 − 0.2| is 0.30000000000000004 in floating point; on the decimals it equals the ± 0.3.
    const { selections: rows, disagreements: flagged } = selectValues(
      [nasa('0.2'), value('codata-1989', '-0.1', '0.3')],
      [],
    );
    expect(rows.map((r) => r.source)).toEqual(['codata-1989']);
    expect(flagged).toEqual([]);
    const beyond = selectValues([nasa('0.2001'), value('codata-1989', '-0.1', '0.3')], []);
    expect(beyond.selections.map((r) => r.source)).toEqual(['nasa-tm4513']);
    expect(beyond.disagreements).toEqual([
      {
        species: 'X(g)',
        property: 'dfH298',
        selectedSource: 'nasa-tm4513',
        otherSource: 'codata-1989',
        difference: '-0.3001',
        statedUncertainty: '0.3',
      },
    ]);
  });

  it('takes Pedley when CODATA disagrees with the NASA value and Pedley agrees, flagging CODATA', () => {
    const { selections: rows, disagreements: flagged } = selectValues(
      [nasa('-100.00'), value('codata-1989', '-101.0', '0.5'), value('pedley-1986', '-100.2', '0.3')],
      [],
    );
    expect(rows.map((r) => r.source)).toEqual(['pedley-1986']);
    // CODATA's own ± 0.5 does not reach the selected −100.2 either: flagged.
    expect(flagged).toEqual([
      {
        species: 'X(g)',
        property: 'dfH298',
        selectedSource: 'pedley-1986',
        otherSource: 'codata-1989',
        difference: '-0.8',
        statedUncertainty: '0.5',
      },
    ]);
    expect(rows[0]!.reason).toMatch(
      /CODATA 1989 Key Value differs by 0\.80 kJ\/mol, beyond its ± 0\.5: flagged for a curator/,
    );
  });

  it('never lets a value without a stated ± displace the NASA value', () => {
    const rows = selectValues([nasa('-100.00'), value('nbs-1982', '-100.00')], []).selections;
    expect(rows.map((r) => r.source)).toEqual(['nasa-tm4513']);
  });

  it('ranks CRC above a derived value, and stops on a source it does not rank', () => {
    const rows = selectValues([value('odian-2004', '30.8', '', 'derived'), value('crc-handbook-97', '30.0')], []);
    expect(rows.selections.map((r) => r.source)).toEqual(['crc-handbook-97']);
    expect(() => selectValues([value('nbs-1982', '1'), value('some-handbook', '2')], [])).toThrow(SelectionError);
    expect(() => selectValues([value('nbs-1982', '1'), value('nbs-1982', '2')], [])).toThrow(/given twice/);
  });

  it('ignores superseded rows', () => {
    const rows = selectValues([nasa('1.0'), value('codata-1989', '1.0', '0.1', 'superseded')], []).selections;
    expect(rows).toEqual([]);
  });

  it('cp: prefers the NASA polynomial when it covers 298.15 K, even when a constant Cp is offered', () => {
    const rows = selectValues(
      [],
      [model('nbs-1982', 288.15, 308.15, 'relative'), model('nasa-tm4513', 300, 5000, 'formation')],
    ).selections;
    expect(rows).toMatchObject([{ species: 'X(g)', property: 'cp', source: 'nasa-tm4513' }]);
  });

  it('cp: takes a constant Cp covering 298.15 K when the NASA model starts far above it', () => {
    // A liquid fit from its melting point (as NASA's Al(L) from 933.61 K) cannot serve at 298.15 K.
    const rows = selectValues(
      [],
      [model('nasa-tm4513', 933.61, 6000, 'formation'), model('nbs-1982', 273.15, 373.15, 'relative')],
    ).selections;
    expect(rows[0]!.source).toBe('nbs-1982');
    expect(rows[0]!.reason).toMatch(/does not cover 298\.15 K/);
  });

  it('cp: among relative models that cover 298.15 K, takes the widest range', () => {
    const rows = selectValues(
      [],
      [model('nbs-1982', 288.15, 308.15, 'relative'), model('crc-handbook-97', 273.15, 350, 'relative')],
    ).selections;
    expect(rows[0]!.source).toBe('crc-handbook-97');
  });
});
