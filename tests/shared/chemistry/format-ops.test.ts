import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import {
  balanceEquationLines,
  balanceEquationText,
  formatEnthalpy,
  formatEquation,
  formatFormula,
  fromKilojoules,
  parseEquation,
  parseFormula,
  reverseEquation,
  scaleEquation,
  toBalanceBatchReply,
  toKilojoules,
} from '@shared/chemistry';
import { text } from './support';

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
  it('writes fractional hydrate multipliers in every notation', () => {
    const hemihydrate = parseFormula('CaSO4·0.5H2O(s)');
    expect(formatFormula(hemihydrate, 'text')).toBe('CaSO4·1/2H2O(s)');
    expect(formatFormula(hemihydrate, 'unicode')).toBe('CaSO₄·½H₂O(s)');
    expect(formatFormula(hemihydrate, 'html')).toBe('CaSO<sub>4</sub>·½H<sub>2</sub>O(s)');
    expect(formatFormula(hemihydrate, 'mhchem')).toBe('\\ce{CaSO4*1/2H2O(s)}');
    expect(formatFormula(parseFormula('X·2/5H2O'.replace('X', 'MgSO4')), 'unicode')).toBe('MgSO₄·2/5H₂O');
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
    const r = balanceEquationText('Fe^2+ + MnO4- + H+ -> Fe^3+ + Mn^2+ + H2O');
    expect(formatEquation(r.equation, 'text')).toBe('5 Fe^2+ + MnO4^- + 8 H^+ -> 5 Fe^3+ + Mn^2+ + 4 H2O');
    expect(formatEquation(r.equation, 'html')).toContain('5 Fe<sup>2+</sup>');
  });
  it('keeps the equilibrium arrow', () => {
    expect(formatEquation(parseEquation('N2 + 3H2 <=> 2NH3'), 'unicode')).toBe('N₂ + 3 H₂ ⇌ 2 NH₃');
  });
  it('gives text that parses back to the same equation', () => {
    const eq = parseEquation('1/2 N2(g) + 3/2 H2(g) -> NH3(g), ΔH = -45.9 kJ');
    const again = parseEquation(formatEquation(eq, 'text'));
    expect(again.terms.map((t) => [text(t.coefficient), t.species.hill, t.species.phase])).toEqual(
      eq.terms.map((t) => [text(t.coefficient), t.species.hill, t.species.phase]),
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
    expect(half.terms.map((t) => text(t.coefficient))).toEqual(['1/2', '1', '1/2', '1']);
    expect(half.enthalpy?.value).toBeCloseTo(-445.15, 12);
    const third = scaleEquation(eq, new Fraction(1, 3));
    expect(third.terms.map((t) => text(t.coefficient))).toEqual(['1/3', '2/3', '1/3', '2/3']);
    expect(scaleEquation(eq, '-1').enthalpy?.value).toBeCloseTo(890.3, 12);
    expect(() => scaleEquation(eq, '0')).toThrow(RangeError);
    expect(() => scaleEquation(eq, '1e307')).toThrow(RangeError); // ΔH would not be a finite number
  });
});

describe('energy units', () => {
  it('uses the thermochemical calorie (4.184 J exactly)', () => {
    expect(toKilojoules(1, 'kcal')).toBe(4.184);
    expect(toKilojoules(1000, 'J')).toBe(1);
    expect(fromKilojoules(4.184, 'cal')).toBeCloseTo(1000, 9);
  });
});

describe('formatEnthalpy', () => {
  it('writes ΔH with its uncertainty and the typographic minus where the notation has one', () => {
    const dh = { value: -285.83, uncertainty: 0.04 };
    expect(formatEnthalpy(dh, 'text')).toBe('ΔH = -285.83 ± 0.04 kJ/mol');
    expect(formatEnthalpy(dh, 'unicode')).toBe('ΔH = −285.83 ± 0.04 kJ/mol');
    expect(formatEnthalpy(dh, 'html')).toBe('Δ<i>H</i> = −285.83 ± 0.04 kJ mol<sup>−1</sup>');
  });
});

describe('balanceEquationLines', () => {
  it('balances one equation per line, skips blanks and comments, keeps input line numbers', () => {
    const out = balanceEquationLines('# combustion\nCH4 + O2 -> CO2 + H2O\n\n  \nH2 + Xx -> H2\r\nN2 + H2 -> NH3');
    expect(out.map((l) => [l.line, l.offset])).toEqual([
      [2, 13],
      [5, 39],
      [6, 54],
    ]);
    const bad = out[1]!;
    expect('error' in bad && bad.error.message).toBe("Unknown element symbol 'Xx' at line 5, column 6");
    expect('error' in bad && bad.error.details).toMatchObject({ line: 5, column: 6, offset: 44, length: 2 });
    const last = out[2]!;
    expect('balancing' in last && formatEquation(last.balancing.equation, 'text')).toBe('N2 + 3 H2 -> 2 NH3');
  });

  it('gives the same lines on the wire, with the problem apart from its place', () => {
    const [bad] = toBalanceBatchReply(balanceEquationLines('\nH2 + Xx -> H2')).results;
    expect(bad).toEqual({
      line: 2,
      source: 'H2 + Xx -> H2',
      error: {
        message: "Unknown element symbol 'Xx' at line 2, column 6",
        problem: "Unknown element symbol 'Xx'",
        code: 'parse_error',
        details: { line: 2, column: 6, offset: 6, length: 2, excerpt: 'H2 + Xx -> H2', expected: [] },
      },
    });
  });
});
