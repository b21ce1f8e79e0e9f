import { elements } from 'chemical-elements';
import { MF } from 'mf-parser';
import { describe, expect, it } from 'vitest';
import { ELEMENT_SYMBOLS, molarMass, parseFormula, standardAtomicWeights } from '@shared/chemistry';
import { counts } from './support';

// References. Atomic masses: the `chemical-elements` npm package (cheminfo), whose `mass` is the
// mean atomic mass from isotopic abundances. Reading formulas: `mf-parser` (cheminfo), which has a
// formula parser of its own. mf-parser is NOT a second reference for masses: it depends on
// chemical-elements (its package.json lists "chemical-elements": "^2.3.3"; `npm ls` shows the one
// copy, deduped) and takes its masses from it. So masses are checked once against
// chemical-elements, and whole molar masses against handbook values instead.
describe('ELEMENT_SYMBOLS', () => {
  it('lists the same 118 symbols in the same order as chemical-elements', () => {
    expect(ELEMENT_SYMBOLS).toEqual(elements.map((e) => e.symbol));
  });
});

describe('standardAtomicWeights', () => {
  // Policy under test: our values are CIAAW 2021 (typed from memory). They must agree with the
  // package within our stated uncertainty. Exceptions: the package's Se and Hg means come from
  // older isotopic compositions than the current CIAAW values, so they get 0.015 (from memory).
  const OLDER_IN_PACKAGE = new Set(['Se', 'Hg']);
  for (const e of elements) {
    it(`${e.symbol}: agrees with chemical-elements`, () => {
      const w = standardAtomicWeights[e.symbol];
      expect(w).toBeDefined();
      if (e.mass === null) {
        // No standard atomic weight in either source: we use a mass number, and say so.
        expect(w!.kind).toBe('mass-number');
        expect(Number.isInteger(w!.value)).toBe(true);
        return;
      }
      expect(w!.kind === 'standard' || w!.kind === 'conventional').toBe(true);
      const tolerance = OLDER_IN_PACKAGE.has(e.symbol) ? 0.015 : w!.uncertainty + 1e-6;
      expect(Math.abs(w!.value - e.mass)).toBeLessThanOrEqual(tolerance);
    });
  }

  it('gives the CIAAW conventional values for interval elements', () => {
    // CIAAW 2021 (Prohaska et al., Pure Appl. Chem. 94 (2022) 573), conventional values; from memory.
    expect(standardAtomicWeights.H!.value).toBe(1.008);
    expect(standardAtomicWeights.C!.value).toBe(12.011);
    expect(standardAtomicWeights.O!.value).toBe(15.999);
    expect(standardAtomicWeights.Cl!.value).toBe(35.45);
    expect(standardAtomicWeights.Pb!.value).toBe(207.2);
    for (const w of Object.values(standardAtomicWeights)) {
      if (w.kind === 'conventional') expect(w.interval).toHaveLength(2);
    }
  });
});

describe('molarMass', () => {
  const mass = (formula: string) => molarMass(parseFormula(formula).composition);

  it('computes water from the CIAAW conventional values exactly', () => {
    // 2 × 1.008 + 15.999 = 18.015 g/mol (CIAAW 2021 conventional values).
    const m = mass('H2O');
    expect(m.value).toBeCloseTo(18.015, 10);
    expect(m.unit).toBe('g/mol');
    // u = √((2·0.0002)² + 0.001²) = 0.001077 (our stated propagation rule).
    expect(m.uncertainty).toBeCloseTo(Math.sqrt(0.0004 ** 2 + 0.001 ** 2), 12);
    expect(m.conventionalElements.sort()).toEqual(['H', 'O']);
  });

  it('flags elements that have no standard atomic weight', () => {
    const m = mass('TcO4');
    expect(m.approximateElements).toEqual(['Tc']);
    expect(m.value).toBeCloseTo(97 + 4 * 15.999, 9);
  });

  // Molar masses as tabulated in the CRC Handbook of Chemistry and Physics ("Physical constants of
  // inorganic/organic compounds"); from memory. The Handbook used the IUPAC weights of its year, so
  // allow 0.01 g/mol (or three times our uncertainty, if larger).
  const handbook: Array<[string, number]> = [
    ['CO2', 44.009],
    ['C6H12O6', 180.156],
    ['KMnO4', 158.032],
    ['CuSO4·5H2O', 249.685],
    ['Na2B4O7·10H2O', 381.372],
    ['UF6', 352.019],
    ['CaSO4·½H2O', 145.148], // calcium sulfate hemihydrate: a fractional formula unit
    ['K3[Fe(CN)6]', 329.244],
  ];
  for (const [formula, value] of handbook) {
    it(`${formula}: ${value} g/mol as the handbook gives it`, () => {
      const m = mass(formula);
      expect(Math.abs(m.value - value)).toBeLessThanOrEqual(Math.max(0.01, 3 * m.uncertainty));
    });
  }

  it('counts a fractional unit exactly: M(CaSO4·½H2O) = M(CaSO4) + ½ M(H2O), uncertainty included', () => {
    const hemi = mass('CaSO4·0.5H2O');
    const whole = mass('(CaSO4)2·H2O');
    expect(hemi.value).toBeCloseTo(whole.value / 2, 10);
    expect(hemi.uncertainty).toBeCloseTo(whole.uncertainty / 2, 12);
  });

  // The same atoms as mf-parser reads them (an independent formula parser). Its notation differs:
  // it reads "." in CuSO4.5H2O as a decimal and [ ] as isotope markers, so hydrates are written
  // (H2O)n and square brackets as parentheses there.
  const cases: Array<[string, string]> = [
    ['C57H110O6', 'C57H110O6'],
    ['C8H18', 'C8H18'],
    ['CuSO4·5H2O', 'CuSO4(H2O)5'],
    ['K3[Fe(CN)6]', 'K3(Fe(CN)6)'],
    ['[Cu(NH3)4]SO4', '(Cu(NH3)4)SO4'],
    ['Ca3(PO4)2', 'Ca3(PO4)2'],
    ['KMnO4', 'KMnO4'],
    ['Na2B4O7·10H2O', 'Na2B4O7(H2O)10'],
    ['UF6', 'UF6'],
    ['C6H12O6', 'C6H12O6'],
  ];
  for (const [ours, theirs] of cases) {
    it(`${ours}: same atoms as mf-parser reads in ${theirs}`, () => {
      const info = new MF(theirs).getInfo() as { atoms: Record<string, number> };
      const atoms = Object.fromEntries(Object.entries(info.atoms).map(([symbol, n]) => [symbol, String(n)]));
      expect(counts(parseFormula(ours).composition)).toEqual(atoms);
    });
  }

  it('counts deuterium at the atomic mass of ²H', () => {
    // m(²H) = 2.014101778 u (AME 2020; from memory).
    expect(mass('D2O').value).toBeCloseTo(2 * 2.01410177812 + 15.999, 8);
  });
});
