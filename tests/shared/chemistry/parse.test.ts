import { elements } from 'chemical-elements';
import { describe, expect, it } from 'vitest';
import { EquationParseError, MAX_NESTING, parseEquation, parseFormula } from '@shared/chemistry';
import { counts, text } from './support';

const composition = (formula: string): Record<string, string> => counts(parseFormula(formula).composition);

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
    expect(composition('Ca3(PO4)2')).toEqual({ Ca: '3', P: '2', O: '8' });
    expect(composition('K4[Fe(CN)6]')).toEqual({ K: '4', Fe: '1', C: '6', N: '6' });
  });

  it('tells Co (cobalt) from CO (carbon monoxide)', () => {
    expect(composition('Co')).toEqual({ Co: '1' });
    expect(composition('CO')).toEqual({ C: '1', O: '1' });
  });

  it('reads (s) after a formula as a phase, not as a group of sulfur', () => {
    const sp = parseFormula('NaCl(s)');
    expect(counts(sp.composition)).toEqual({ Na: '1', Cl: '1' });
    expect(sp.phase).toBe('s');
    expect(composition('Na2(S)')).toEqual({ Na: '2', S: '1' });
  });

  it('reads every phase label and a descriptor', () => {
    for (const p of ['s', 'l', 'g', 'aq', 'cr', 'am'] as const) expect(parseFormula(`H2O(${p})`).phase).toBe(p);
    const c = parseFormula('C(cr, graphite)');
    expect([c.phase, c.descriptor]).toEqual(['cr', 'graphite']);
    expect(parseFormula('S(cr,rhombic)').descriptor).toBe('rhombic');
    expect(parseFormula('H2O (l)').phase).toBe('l');
  });

  it('reads hydrates and adducts written with ·, * or .', () => {
    for (const typed of ['CuSO4·5H2O', 'CuSO4*5H2O', 'CuSO4.5H2O', 'CuSO4 · 5H2O', 'CuSO4·5 H2O']) {
      expect(composition(typed)).toEqual({ Cu: '1', S: '1', O: '9', H: '10' });
    }
    expect(composition('(CaSO4)2·H2O')).toEqual({ Ca: '2', S: '2', O: '9', H: '2' });
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
    expect([counts(nh4.composition), nh4.charge, nh4.warnings]).toEqual([{ N: '1', H: '4' }, 1, []]);
    const o2 = parseFormula('O2-'); // superoxide
    expect([counts(o2.composition), o2.charge, o2.warnings.length]).toEqual([{ O: '2' }, -1, 0]);
    const complex = parseFormula('[Fe(CN)6]3-');
    expect([counts(complex.composition), complex.charge, complex.formula]).toEqual([
      { Fe: '1', C: '6', N: '6' },
      -3,
      '[Fe(CN)6]^3-',
    ]);
  });

  it('warns when the trailing-sign reading looks unlikely and shows the reading', () => {
    const fe = parseFormula('Fe3+');
    expect(counts(fe.composition)).toEqual({ Fe: '3' });
    expect(fe.charge).toBe(1);
    expect(fe.warnings[0]?.code).toBe('ambiguous_charge');
    expect(fe.warnings[0]?.message).toContain('Fe^3+');
    const so4 = parseFormula('SO42-');
    expect(counts(so4.composition)).toEqual({ S: '1', O: '42' });
    expect(so4.warnings[0]?.message).toContain('SO4^2-');
  });

  it('reads Unicode subscripts', () => {
    expect(composition('H₂O')).toEqual({ H: '2', O: '1' });
    expect(composition('C₅₇H₁₁₀O₆')).toEqual({ C: '57', H: '110', O: '6' });
  });

  it('keeps deuterium and tritium as their own symbols', () => {
    expect(composition('D2O')).toEqual({ D: '2', O: '1' });
    expect(composition('HTO')).toEqual({ H: '1', T: '1', O: '1' });
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

  it('accepts all 118 element symbols, each alone and all in one formula', () => {
    // The list of symbols comes from the chemical-elements package (cheminfo), not from our table.
    const symbols = elements.map((e) => e.symbol);
    expect(symbols).toHaveLength(118);
    for (const symbol of symbols) {
      expect(composition(symbol)).toEqual({ [symbol]: '1' });
      expect(composition(`${symbol}2`)).toEqual({ [symbol]: '2' });
    }
    const all = parseFormula(symbols.join(''));
    expect(Object.keys(all.composition).sort()).toEqual([...symbols].sort());
    expect(Object.values(all.composition).every((c) => text(c) === '1')).toBe(true);
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
    expect(eq.terms.map((t) => text(t.coefficient)).slice(0, 5)).toEqual(['1/2', '1/2', '3/2', '1/8', '1/2']);
    expect(parseEquation('2H2 + O2 -> 2H2O').terms.map((t) => [text(t.coefficient), t.coefficientWritten])).toEqual([
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
    expect(err.position).toMatchObject({ line: 1, column: 7, offset: 6, length: 2 });
    expect(err.position.excerpt).toContain('Xx');
    expect(err.code).toBe('parse_error');
    expect(err.problem).toBe("Unknown element symbol 'Xx'");
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
    expect(parseErrorOf(() => parseEquation('CaSO4·0H2O -> CaSO4')).message).toMatch(/greater than zero.*column 7/);
    expect(parseErrorOf(() => parseEquation('CaSO4·1/0H2O -> CaSO4')).message).toMatch(/denominator.*column 7/);
    expect(parseErrorOf(() => parseEquation('H1234567890 -> H')).message).toMatch(/more than 9 digits/);
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

describe('fractional formula units', () => {
  // Calcium sulfate hemihydrate, CaSO4·½H2O: one formula unit holds half a water (common practice, no source).
  it('reads ½, 1/2 and 0.5 as the same exact multiplier', () => {
    for (const typed of ['CaSO4·½H2O', 'CaSO4·1/2H2O', 'CaSO4·0.5H2O', 'CaSO4 · 1/2 H2O', 'CaSO4*0.5H2O']) {
      expect(composition(typed)).toEqual({ Ca: '1', S: '1', O: '9/2', H: '1' });
    }
    expect(composition('CaSO4·⅓H2O')).toEqual({ Ca: '1', S: '1', O: '13/3', H: '2/3' });
    expect(composition('Na2CO3·1.5H2O2')).toEqual({ Na: '2', C: '1', O: '6', H: '3' });
  });

  it('keeps the multiplier exact in the structure and writes it back as a fraction', () => {
    const sp = parseFormula('CaSO4·0.5H2O(s)');
    expect(text(sp.parts[1]!.multiplier)).toBe('1/2');
    expect(sp.formula).toBe('CaSO4·1/2H2O');
    expect(parseFormula(sp.formula).formula).toBe('CaSO4·1/2H2O');
  });

  it('writes the Hill formula of one unit as written, with exact fractional counts', () => {
    // Our stated convention (hill.ts): counts of the unit as written, decimals where they terminate.
    expect(parseFormula('CaSO4·½H2O').hill).toBe('CaHO4.5S');
    expect(parseFormula('CaSO4·⅓H2O').hill).toBe('CaH2/3O13/3S');
    expect(parseFormula('C2H5OH·0.25H2O').hill).toBe('C2H6.5O1.25');
    // Whole units are unchanged: the doubled hemihydrate is the ordinary Hill formula.
    expect(parseFormula('(CaSO4)2·H2O').hill).toBe('Ca2H2O9S2');
  });

  it('reads coefficients before a fractional unit as coefficients', () => {
    const eq = parseEquation('2 CaSO4·½H2O(s) + 3 H2O(l) -> 2 CaSO4·2H2O(s)');
    expect(eq.terms.map((t) => [text(t.coefficient), t.species.hill])).toEqual([
      ['2', 'CaHO4.5S'],
      ['3', 'H2O'],
      ['2', 'CaH4O6S'],
    ]);
  });
});

describe('nesting limit', () => {
  it(`reads ${MAX_NESTING} nested groups and refuses one more, naming line and column`, () => {
    const nested = (depth: number): string => '('.repeat(depth) + 'H' + ')2'.repeat(depth);
    expect(composition(nested(MAX_NESTING))).toEqual({ H: String(2 ** MAX_NESTING) });
    const err = parseErrorOf(() => parseEquation(`${nested(MAX_NESTING + 1)} -> H2`));
    expect(err.message).toMatch(new RegExp(`nested more than ${MAX_NESTING} levels deep at column ${MAX_NESTING + 1}`));
    expect(err.position).toMatchObject({ line: 1, column: MAX_NESTING + 1, offset: MAX_NESTING, length: 1 });
  });

  it('refuses 3,000 open brackets with a parse error rather than a stack overflow', () => {
    const err = parseErrorOf(() => parseEquation(`${'['.repeat(3000)}H -> H`));
    expect(err.position.column).toBe(MAX_NESTING + 1);
    expect(parseErrorOf(() => parseFormula('(H'.repeat(5000))).code).toBe('parse_error');
  });

  it('names the line of a deep nesting in a multi-line text', () => {
    const err = parseErrorOf(() => parseEquation(`H2 -> H2\n${'('.repeat(40)}`));
    expect(err.position).toMatchObject({ line: 2, column: MAX_NESTING + 1 });
  });
});
