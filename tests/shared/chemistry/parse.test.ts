import { describe, expect, it } from 'vitest';
import { EquationParseError, parseEquation, parseFormula } from '@shared/chemistry';

/** Runs `fn` and returns the EquationParseError it throws (fails the test otherwise). */
function parseErrorOf(fn: () => unknown): EquationParseError {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(EquationParseError);
    return err as EquationParseError;
  }
  throw new Error('expected an EquationParseError');
}

describe('parseFormula', () => {
  it('reads nested groups with multipliers', () => {
    expect(parseFormula('Ca3(PO4)2').composition).toEqual({ Ca: 3, P: 2, O: 8 });
    expect(parseFormula('K4[Fe(CN)6]').composition).toEqual({ K: 4, Fe: 1, C: 6, N: 6 });
  });

  it('tells Co (cobalt) from CO (carbon monoxide)', () => {
    expect(parseFormula('Co').composition).toEqual({ Co: 1 });
    expect(parseFormula('CO').composition).toEqual({ C: 1, O: 1 });
  });

  it('reads (s) after a formula as a phase, not as a group of sulfur', () => {
    const sp = parseFormula('NaCl(s)');
    expect(sp.composition).toEqual({ Na: 1, Cl: 1 });
    expect(sp.phase).toBe('s');
    expect(parseFormula('Na2(S)').composition).toEqual({ Na: 2, S: 1 });
  });

  it('reads every phase label and a descriptor', () => {
    for (const p of ['s', 'l', 'g', 'aq', 'cr', 'am'] as const) expect(parseFormula(`H2O(${p})`).phase).toBe(p);
    const c = parseFormula('C(cr, graphite)');
    expect([c.phase, c.descriptor]).toEqual(['cr', 'graphite']);
    expect(parseFormula('S(cr,rhombic)').descriptor).toBe('rhombic');
    expect(parseFormula('H2O (l)').phase).toBe('l');
  });

  it('reads hydrates and adducts written with ·, * or .', () => {
    for (const text of ['CuSO4·5H2O', 'CuSO4*5H2O', 'CuSO4.5H2O', 'CuSO4 · 5H2O']) {
      expect(parseFormula(text).composition).toEqual({ Cu: 1, S: 1, O: 9, H: 10 });
    }
    expect(parseFormula('(CaSO4)2·H2O').composition).toEqual({ Ca: 2, S: 2, O: 9, H: 2 });
  });

  it('reads every charge notation', () => {
    const charge = (t: string): number => parseFormula(t).charge;
    expect(charge('SO4^2-')).toBe(-2);
    expect(charge('SO4{2-}')).toBe(-2);
    expect(charge('SO4^{2-}')).toBe(-2);
    expect(charge('SO4(2-)')).toBe(-2);
    expect(charge('Fe^3+')).toBe(3);
    expect(charge('Fe^+3')).toBe(3);
    expect(charge('Na^+')).toBe(1);
    expect(charge('Cl-')).toBe(-1);
    expect(charge('NH4+')).toBe(1);
    expect(charge('SO₄²⁻')).toBe(-2);
    expect(charge('Fe³⁺')).toBe(3);
    expect(charge('[Fe(CN)6]^3-')).toBe(-3);
    expect(charge('[Fe(CN)6]3-')).toBe(-3);
    expect(charge('[Cu(NH3)4]2+')).toBe(2);
    expect(charge('e-')).toBe(-1);
    expect(charge('e^-')).toBe(-1);
    expect(charge('e⁻')).toBe(-1);
    expect(charge('SO4^2−')).toBe(-2); // U+2212 minus sign
  });

  it('keeps digits before a trailing sign as subscripts, except after ]', () => {
    const nh4 = parseFormula('NH4+');
    expect([nh4.composition, nh4.charge, nh4.warnings]).toEqual([{ N: 1, H: 4 }, 1, []]);
    const o2 = parseFormula('O2-'); // superoxide
    expect([o2.composition, o2.charge, o2.warnings.length]).toEqual([{ O: 2 }, -1, 0]);
    const complex = parseFormula('[Fe(CN)6]3-');
    expect([complex.composition, complex.charge, complex.formula]).toEqual([{ Fe: 1, C: 6, N: 6 }, -3, '[Fe(CN)6]^3-']);
  });

  it('warns when the trailing-sign reading looks unlikely and shows the reading', () => {
    const fe = parseFormula('Fe3+');
    expect(fe.composition).toEqual({ Fe: 3 });
    expect(fe.charge).toBe(1);
    expect(fe.warnings[0]?.code).toBe('ambiguous_charge');
    expect(fe.warnings[0]?.message).toContain('Fe^3+');
    const so4 = parseFormula('SO42-');
    expect(so4.composition).toEqual({ S: 1, O: 42 });
    expect(so4.warnings[0]?.message).toContain('SO4^2-');
  });

  it('reads Unicode subscripts', () => {
    expect(parseFormula('H₂O').composition).toEqual({ H: 2, O: 1 });
    expect(parseFormula('C₅₇H₁₁₀O₆').composition).toEqual({ C: 57, H: 110, O: 6 });
  });

  it('keeps deuterium and tritium as their own symbols', () => {
    expect(parseFormula('D2O').composition).toEqual({ D: 2, O: 1 });
    expect(parseFormula('HTO').composition).toEqual({ H: 1, T: 1, O: 1 });
    expect(parseFormula('CDCl3').hill).toBe('CDCl3'); // D placed after H when C is present (our rule)
    expect(parseFormula('T2O').hill).toBe('OT2'); // alphabetical without carbon
  });

  it('writes Hill order: C, H, then alphabetical; no carbon → all alphabetical', () => {
    // Hill, J. Am. Chem. Soc. 22 (1900) 478 (from memory); examples are common practice.
    expect(parseFormula('CH3COOH').hill).toBe('C2H4O2');
    expect(parseFormula('H2SO4').hill).toBe('H2O4S');
    expect(parseFormula('NaCl').hill).toBe('ClNa');
    expect(parseFormula('CH3Cl').hill).toBe('CH3Cl');
    expect(parseFormula('C2H5Br').hill).toBe('C2H5Br');
  });

  it('accepts all 118 element symbols', () => {
    expect(parseFormula('OgTsLvMcFlNhCnRgDsMtHsBhSgDbRfLr').hill).toBe('BhCnDbDsFlHsLrLvMcMtNhOgRfRgSgTs');
  });
});

describe('parseEquation', () => {
  it('accepts every arrow', () => {
    for (const arrow of ['->', '→', '=', '<=>', '⇌']) {
      const eq = parseEquation(`2H2 + O2 ${arrow} 2H2O`);
      expect(eq.arrow).toBe(arrow);
      expect(eq.terms.map((t) => t.side)).toEqual(['reactant', 'reactant', 'product']);
    }
    expect(parseEquation('N2 + 3H2 ⇌ 2NH3').equilibrium).toBe(true);
  });

  it('reads whole, decimal, fraction and vulgar coefficients exactly', () => {
    const eq = parseEquation('1/2 O2(g) + 0.5 N2 + 3/2H2 + 0.125 Cl2 + ½ Br2 -> Ar');
    expect(eq.terms.map((t) => t.coefficient).slice(0, 5)).toEqual(['1/2', '1/2', '3/2', '1/8', '1/2']);
    expect(parseEquation('2H2 + O2 -> 2H2O').terms.map((t) => [t.coefficient, t.coefficientWritten])).toEqual([
      ['2', true],
      ['1', false],
      ['2', true],
    ]);
  });

  it('tolerates missing and extra spaces, and no spaces around +', () => {
    const eq = parseEquation('  H2+O2->H2O  ');
    expect(eq.terms.map((t) => t.species.formula)).toEqual(['H2', 'O2', 'H2O']);
    const ions = parseEquation('Na++Cl-->NaCl');
    expect(ions.terms.map((t) => [t.species.formula, t.species.charge])).toEqual([
      ['Na^+', 1],
      ['Cl^-', -1],
      ['NaCl', 0],
    ]);
  });

  it('reads a trailing ΔH in kJ, J, kcal and cal (thermochemical calorie)', () => {
    // 1 cal = 4.184 J exactly (IUPAC Green Book, 3rd ed., 2007; from memory).
    const dh = (tail: string): number | undefined => parseEquation(`H2 + 1/2 O2 -> H2O${tail}`).enthalpy?.value;
    expect(dh(', ΔH = -285.8 kJ')).toBeCloseTo(-285.8, 12);
    expect(dh('; dH = +50 kJ/mol')).toBeCloseTo(50, 12);
    expect(dh(' ΔH = -285800 J')).toBeCloseTo(-285.8, 9);
    expect(dh(', ΔH = -10 kcal/mol')).toBeCloseTo(-41.84, 12);
    expect(dh(', ΔH = 1000 cal')).toBeCloseTo(4.184, 12);
    expect(dh(', ∆rH° = −285.83 kJ mol^-1')).toBeCloseTo(-285.83, 12);
    expect(dh(', ΔH = -45.2 kJ mol⁻¹')).toBeCloseTo(-45.2, 12);
    const withU = parseEquation('H2 + 1/2 O2 -> H2O, ΔH = -285.83 ± 0.04 kJ/mol').enthalpy;
    expect(withU?.uncertainty).toBeCloseTo(0.04, 12);
    expect(withU?.stated).toEqual({ value: -285.83, unit: 'kJ', perMol: true, uncertainty: 0.04 });
  });

  it('moves a heat term into ΔH with the right sign', () => {
    // Heat as a product = heat released = exothermic, ΔH < 0 (standard sign convention).
    expect(parseEquation('CH4 + 2O2 -> CO2 + 2H2O + 890.3 kJ').enthalpy?.value).toBeCloseTo(-890.3, 12);
    expect(parseEquation('CaCO3 + 178.3 kJ -> CaO + CO2').enthalpy?.value).toBeCloseTo(178.3, 12);
    expect(parseEquation('N2 + O2 + 43.2 kcal -> 2NO').enthalpy?.value).toBeCloseTo(43.2 * 4.184, 9);
    const eq = parseEquation('CH4 + 2O2 -> CO2 + 2H2O + 890 kJ');
    expect(eq.terms).toHaveLength(4);
    expect(eq.heatTerms[0]?.side).toBe('product');
  });

  it('warns when a heat term and a stated ΔH disagree', () => {
    const eq = parseEquation('A2 -> 2A + 10 kJ, ΔH = +10 kJ'.replace(/A/g, 'Ar'));
    expect(eq.warnings.map((w) => w.code)).toContain('heat_term_disagrees');
  });

  it('names an unknown element symbol and points at its column', () => {
    const err = parseErrorOf(() => parseEquation('2H2 + Xx -> H2Xx'));
    expect(err.message).toBe("Unknown element symbol 'Xx' at column 7");
    expect(err.position).toMatchObject({ line: 1, column: 7, offset: 6 });
    expect(err.position.excerpt).toContain('Xx');
    expect(err.code).toBe('parse_error');
  });

  it('explains a missing arrow in plain words', () => {
    const err = parseErrorOf(() => parseEquation('H2 + O2'));
    expect(err.message).toMatch(/without an arrow/);
    expect(err.position.column).toBe(8);
    expect(err.position.expected.some((e) => e.startsWith('an arrow'))).toBe(true);
    expect(err.message).not.toMatch(/Expected .* but .* found/);
  });

  it('rewrites generic parser messages into plain words', () => {
    const err = parseErrorOf(() => parseEquation('H2 -> H2 x'));
    expect(err.message).toMatch(/^Expected .* but found 'x' at column 10$/);
    expect(err.message).not.toMatch(/\[|\\/);
  });

  it('explains lowercase symbols, bad phase labels, missing units and zero coefficients', () => {
    expect(parseErrorOf(() => parseEquation('h2 -> H2')).message).toMatch(/capital letter.*column 1/);
    expect(parseErrorOf(() => parseEquation('H2O(x) -> H2O')).message).toMatch(/unknown phase label 'x'.*column 4/i);
    expect(parseErrorOf(() => parseEquation('H2 -> H2, ΔH = -4')).message).toMatch(/unit/);
    expect(parseErrorOf(() => parseEquation('0 H2 -> H2')).message).toMatch(/greater than zero.*column 1/);
    expect(parseErrorOf(() => parseEquation('Fe^3 -> Fe')).message).toMatch(/needs a sign/);
    expect(parseErrorOf(() => parseEquation('H0 -> H')).message).toMatch(/at least 1/);
    expect(parseErrorOf(() => parseEquation('CaSO4·1/2H2O -> CaSO4')).message).toMatch(/whole number/);
  });

  it('refuses a second line, pointing at the line break', () => {
    const err = parseErrorOf(() => parseEquation('H2 -> H2\nO2 -> O2'));
    expect(err.position).toMatchObject({ line: 1, column: 9, offset: 8 });
    expect(err.message).toMatch(/line break/);
  });

  it('reads a full thermochemical equation with phases and Unicode', () => {
    const eq = parseEquation('C(cr, graphite) + O₂(g) → CO₂(g), ΔH = −393.51 kJ/mol');
    expect(eq.terms.map((t) => [t.species.hill, t.species.phase, t.species.descriptor])).toEqual([
      ['C', 'cr', 'graphite'],
      ['O2', 'g', null],
      ['CO2', 'g', null],
    ]);
    expect(eq.enthalpy?.value).toBeCloseTo(-393.51, 12);
  });
});
