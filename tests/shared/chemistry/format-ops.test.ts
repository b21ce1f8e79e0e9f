import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import {
  balanceEquationText,
  formatEquation,
  formatFormula,
  fromKilojoules,
  parseEquation,
  parseEquationBatch,
  parseFormula,
  reverseEquation,
  scaleEquation,
  toKilojoules,
} from '@shared/chemistry';

describe('formatFormula', () => {
  const so4 = parseFormula('SO4^2-(aq)');
  it('writes plain text, Unicode, HTML and mhchem', () => {
    expect(formatFormula(so4, 'text')).toBe('SO4^2-(aq)');
    expect(formatFormula(so4, 'unicode')).toBe('SO₄²⁻(aq)');
    expect(formatFormula(so4, 'html')).toBe('SO<sub>4</sub><sup>2−</sup>(aq)');
    expect(formatFormula(so4, 'mhchem')).toBe('\\ce{SO4^2-(aq)}');
  });
  it('writes hydrates, complexes and descriptors', () => {
    expect(formatFormula(parseFormula('CuSO4*5H2O(s)'), 'html')).toBe('CuSO<sub>4</sub>·5H<sub>2</sub>O(s)');
    expect(formatFormula(parseFormula('CuSO4·5H2O'), 'mhchem')).toBe('\\ce{CuSO4*5H2O}');
    expect(formatFormula(parseFormula('[Fe(CN)6]3-'), 'unicode')).toBe('[Fe(CN)₆]³⁻');
    expect(formatFormula(parseFormula('C(cr, graphite)'), 'text')).toBe('C(cr, graphite)');
    expect(formatFormula(parseFormula('e-'), 'html')).toBe('e<sup>−</sup>');
  });
  it('escapes HTML in descriptors', () => {
    expect(formatFormula(parseFormula('S(cr, <b>)'), 'html')).toBe('S(cr, &lt;b&gt;)');
  });
});

describe('formatEquation', () => {
  it('formats a parsed equation and a balance result', () => {
    const eq = parseEquation('2H2(g) + O2(g) -> 2H2O(l), ΔH = -571.66 kJ');
    expect(formatEquation(eq, 'unicode')).toBe('2 H₂(g) + O₂(g) → 2 H₂O(l), ΔH = −571.66 kJ/mol');
    expect(formatEquation(eq, 'mhchem')).toBe(
      '\\ce{2 H2(g) + O2(g) -> 2 H2O(l)} \\quad \\Delta H = \\pu{-571.66 kJ mol^-1}',
    );
    const r = balanceEquationText({ equation: 'Fe^2+ + MnO4- + H+ -> Fe^3+ + Mn^2+ + H2O' });
    expect(formatEquation(r, 'text')).toBe(r.equation);
    expect(formatEquation(r, 'html')).toContain('5 Fe<sup>2+</sup>');
  });
  it('keeps the equilibrium arrow', () => {
    expect(formatEquation(parseEquation('N2 + 3H2 <=> 2NH3'), 'unicode')).toBe('N₂ + 3 H₂ ⇌ 2 NH₃');
  });
  it('gives text that parses back to the same equation', () => {
    const eq = parseEquation('1/2 N2(g) + 3/2 H2(g) -> NH3(g), ΔH = -45.9 kJ');
    const again = parseEquation(formatEquation(eq, 'text'));
    expect(again.terms.map((t) => [t.coefficient, t.species.hill, t.species.phase])).toEqual(
      eq.terms.map((t) => [t.coefficient, t.species.hill, t.species.phase]),
    );
    expect(again.enthalpy?.value).toBeCloseTo(-45.9, 12);
  });
});

describe('reverseEquation and scaleEquation', () => {
  const eq = parseEquation('CH4(g) + 2O2(g) -> CO2(g) + 2H2O(l), ΔH = -890.3 kJ');
  it('flips the sign of ΔH when reversed (Hess’s law)', () => {
    const rev = reverseEquation(eq);
    expect(rev.enthalpy?.value).toBeCloseTo(890.3, 12);
    expect(rev.terms.map((t) => [t.side, t.species.hill])).toEqual([
      ['reactant', 'CO2'],
      ['reactant', 'H2O'],
      ['product', 'CH4'],
      ['product', 'O2'],
    ]);
  });
  it('scales coefficients exactly and ΔH by the same factor', () => {
    const half = scaleEquation(eq, '1/2');
    expect(half.terms.map((t) => t.coefficient)).toEqual(['1/2', '1', '1/2', '1']);
    expect(half.enthalpy?.value).toBeCloseTo(-445.15, 12);
    const third = scaleEquation(eq, new Fraction(1, 3));
    expect(third.terms.map((t) => t.coefficient)).toEqual(['1/3', '2/3', '1/3', '2/3']);
    expect(scaleEquation(eq, '-1').enthalpy?.value).toBeCloseTo(890.3, 12);
    expect(() => scaleEquation(eq, '0')).toThrow(RangeError);
  });
});

describe('energy units', () => {
  it('uses the thermochemical calorie (4.184 J exactly)', () => {
    expect(toKilojoules(1, 'kcal')).toBe(4.184);
    expect(toKilojoules(1000, 'J')).toBe(1);
    expect(fromKilojoules(4.184, 'cal')).toBeCloseTo(1000, 9);
  });
});

describe('parseEquationBatch', () => {
  it('balances one equation per line, skips blanks and comments, keeps input line numbers', () => {
    const out = parseEquationBatch('# combustion\nCH4 + O2 -> CO2 + H2O\n\n  \nH2 + Xx -> H2\r\nN2 + H2 -> NH3');
    expect(out.map((l) => l.line)).toEqual([2, 5, 6]);
    const bad = out[1]!;
    expect('error' in bad && bad.error.details).toMatchObject({ line: 5, column: 6 });
    expect('error' in bad && bad.error.message).toBe("Unknown element symbol 'Xx' at line 5, column 6");
    const last = out[2]!;
    expect('result' in last && last.result.equation).toBe('N2 + 3 H2 -> 2 NH3');
  });
});
