import { describe, expect, it } from 'vitest';
import {
  BalanceInputError,
  balanceEquationText,
  balanceRequest,
  DEFAULT_WORK_LIMITS,
  EquationParseError,
} from '@shared/chemistry';
import { balanceResultSchema, type BalanceResult } from '@shared/schemas/balance';
import { text } from './support';

const coefficients = (r: BalanceResult): string[] => r.terms.map((t) => t.coefficient);
/** The API reply for an equation (through the one adapter), checked against the public schema. */
const balance = (equation: string, extra: object = {}): BalanceResult => {
  const r = balanceRequest({ equation, ...extra });
  expect(balanceResultSchema.safeParse(r).success).toBe(true);
  return r;
};

/** Σ coefficient × atoms on each side, per element, with compositions written out by hand in the test. */
function conservedWith(
  compositions: Array<Record<string, number>>,
  sides: Array<1 | -1>,
  coefficients: string[],
): boolean {
  const totals = new Map<string, bigint>();
  compositions.forEach((composition, j) => {
    for (const [symbol, count] of Object.entries(composition)) {
      totals.set(symbol, (totals.get(symbol) ?? 0n) + BigInt(sides[j]!) * BigInt(count) * BigInt(coefficients[j]!));
    }
  });
  return [...totals.values()].every((v) => v === 0n);
}

describe('balanceEquationText — textbook worked examples', () => {
  it('balances the combustion of octane', () => {
    // 2 C8H18 + 25 O2 → 16 CO2 + 18 H2O: N. J. Tro, Chemistry: A Molecular Approach, 4th ed. (Pearson 2017), ch. 4; from memory.
    expect(coefficients(balance('C8H18 + O2 -> CO2 + H2O'))).toEqual(['2', '25', '16', '18']);
  });

  it('balances the combustion of tristearin', () => {
    // 2 C57H110O6 + 163 O2 → 114 CO2 + 110 H2O: T. L. Brown et al., Chemistry: The Central Science,
    // 14th ed. (Pearson 2018), ch. 3 exercises on fat metabolism; from memory.
    expect(coefficients(balance('C57H110O6(s) + O2(g) -> CO2(g) + H2O(l)'))).toEqual(['2', '163', '114', '110']);
  });

  it('balances permanganate with oxalate in acidic solution', () => {
    // 2 MnO4⁻ + 5 C2O4²⁻ + 16 H⁺ → 2 Mn²⁺ + 10 CO2 + 8 H2O: D. C. Harris, Quantitative Chemical
    // Analysis, 9th ed. (Freeman 2016), ch. 16 (permanganate titrations); from memory.
    const r = balance('MnO4^- + C2O4^2- + H^+ -> Mn^2+ + CO2 + H2O');
    expect(coefficients(r)).toEqual(['2', '5', '16', '2', '10', '8']);
  });

  it('balances dichromate with iron(II) in acidic solution', () => {
    // Cr2O7²⁻ + 6 Fe²⁺ + 14 H⁺ → 2 Cr³⁺ + 6 Fe³⁺ + 7 H2O: D. A. Skoog et al., Fundamentals of
    // Analytical Chemistry, 9th ed. (Brooks/Cole 2014), ch. 18; from memory.
    expect(coefficients(balance('Cr2O7{2-}(aq) + Fe²⁺(aq) + H+(aq) -> Cr^3+(aq) + Fe^3+(aq) + H2O(l)'))).toEqual([
      '1',
      '6',
      '14',
      '2',
      '6',
      '7',
    ]);
  });

  it('balances permanganate with cyanide in basic solution', () => {
    // 3 CN⁻ + 2 MnO4⁻ + H2O → 3 CNO⁻ + 2 MnO2 + 2 OH⁻: T. L. Brown et al., Chemistry: The Central
    // Science, 14th ed. (Pearson 2018), ch. 20 sample exercise (basic solution); from memory.
    expect(coefficients(balance('CN- + MnO4- + H2O -> CNO- + MnO2 + OH-'))).toEqual(['3', '2', '1', '3', '2', '2']);
  });

  it('balances permanganate with iodide in basic solution', () => {
    // 2 MnO4⁻ + I⁻ + H2O → 2 MnO2 + IO3⁻ + 2 OH⁻: Brown et al., 14th ed., ch. 20 exercises; from memory.
    expect(coefficients(balance('MnO4- + I- + H2O -> MnO2 + IO3- + OH-'))).toEqual(['2', '1', '1', '2', '1', '2']);
  });

  it('balances hexacyanoferrate(II) oxidation by hydrogen peroxide', () => {
    // 2 [Fe(CN)6]⁴⁻ + H2O2 + 2 H⁺ → 2 [Fe(CN)6]³⁻ + 2 H2O: half-reactions as in Harris, QCA 9th ed.,
    // ch. 14 (ferricyanide/ferrocyanide couple); combination checked by hand, from memory.
    expect(coefficients(balance('[Fe(CN)6]4- + H2O2 + H+ -> [Fe(CN)6]3- + H2O'))).toEqual(['2', '1', '2', '2', '2']);
  });

  it('balances the classic potassium ferrocyanide–permanganate equation', () => {
    // 10 K4[Fe(CN)6] + 122 KMnO4 + 299 H2SO4 → 162 KHSO4 + 5 Fe2(SO4)3 + 122 MnSO4 + 60 HNO3 + 60 CO2 + 188 H2O:
    // a well-known hard balancing exercise (common practice, no source; coefficients from memory).
    const r = balance('K4[Fe(CN)6] + KMnO4 + H2SO4 -> KHSO4 + Fe2(SO4)3 + MnSO4 + HNO3 + CO2 + H2O');
    expect(coefficients(r)).toEqual(['10', '122', '299', '162', '5', '122', '60', '60', '188']);
  });

  it('balances the formation of the tetraammine copper(II) complex', () => {
    // Cu²⁺ + 4 NH3 → [Cu(NH3)4]²⁺: Brown et al., 14th ed., ch. 23 (coordination chemistry); from memory.
    expect(coefficients(balance('Cu^2+ + NH3 -> [Cu(NH3)4]2+'))).toEqual(['1', '4', '1']);
  });

  it('balances the dehydration of copper(II) sulfate pentahydrate and of gypsum', () => {
    // CuSO4·5H2O → CuSO4 + 5 H2O; 2 CaSO4·2H2O → (CaSO4)2·H2O + 3 H2O (plaster of Paris): common practice, no source.
    expect(coefficients(balance('CuSO4·5H2O(s) -> CuSO4(s) + H2O(g)'))).toEqual(['1', '1', '5']);
    expect(coefficients(balance('CaSO4·2H2O -> (CaSO4)2·H2O + H2O'))).toEqual(['2', '1', '3']);
  });

  it('balances electrons in a half-reaction', () => {
    // MnO4⁻ + 8 H⁺ + 5 e⁻ → Mn²⁺ + 4 H2O: Harris, QCA 9th ed., table of standard potentials; from memory.
    expect(coefficients(balance('MnO4- + H+ + e- -> Mn^2+ + H2O'))).toEqual(['1', '8', '5', '1', '4']);
  });
});

describe('balanceEquationText — outcomes', () => {
  it('balances deuterium and tritium as symbols of their own', () => {
    expect(coefficients(balance('D2 + O2 -> D2O'))).toEqual(['2', '1', '2']);
    expect(coefficients(balance('H2 + D2 -> HD'))).toEqual(['1', '1', '2']);
    expect(balance('H2 + T2O -> H2O').status).toBe('impossible'); // T cannot turn into H
  });

  it('shows how each species was read (formula, Hill formula, charge)', () => {
    const r = balance('Fe3+ + NH4+ -> Fe3+ + NH4+');
    expect(r.terms.map((t) => [t.formula, t.hill, t.charge])).toEqual([
      ['Fe3^+', 'Fe3', 1],
      ['NH4^+', 'H4N', 1],
      ['Fe3^+', 'Fe3', 1],
      ['NH4^+', 'H4N', 1],
    ]);
    expect(r.warnings.filter((w) => w.code === 'ambiguous_charge').map((w) => [w.term, w.column])).toEqual([
      [0, 1],
      [2, 16],
    ]);
  });

  it('applies normaliseTo after fixed coefficients have chosen a balancing', () => {
    const r = balance('C + O2 -> CO + CO2', { fixed: { '2': '2', '3': '1' }, normaliseTo: 0 });
    expect(coefficients(r)).toEqual(['1', '2/3', '2/3', '1/3']);
  });

  it('keeps coefficients that balance as given', () => {
    const r = balance('H2(g) + 1/2 O2(g) -> H2O(l), ΔH = -285.83 kJ/mol');
    expect([r.status, r.asGiven, coefficients(r)]).toEqual(['balanced', true, ['1', '1/2', '1']]);
    expect(r.givenImbalance).toBeUndefined();
    expect(r.enthalpy?.value).toBeCloseTo(-285.83, 12);
    expect(r.equation).toBe('H2(g) + 1/2 O2(g) -> H2O(l), ΔH = -285.83 kJ/mol');
  });

  it('gives the smallest whole numbers and the given imbalance per element', () => {
    const r = balance('H2 + O2 -> H2O');
    expect([r.status, r.asGiven, coefficients(r)]).toEqual(['balanced', false, ['2', '1', '2']]);
    expect(r.givenImbalance).toEqual([
      { element: 'H', reactants: '2', products: '2' },
      { element: 'O', reactants: '2', products: '1' },
    ]);
  });

  it('normalises to 1 mol of a chosen species, with fractions, and scales ΔH alike', () => {
    const r = balance('2H2 + O2 -> 2H2O, ΔH = -571.66 kJ', { normaliseTo: 2 });
    expect(coefficients(r)).toEqual(['1', '1/2', '1']);
    expect(r.enthalpy?.value).toBeCloseTo(-285.83, 12);
    expect(coefficients(balance('C8H18 + O2 -> CO2 + H2O', { normaliseTo: 0 }))).toEqual(['1', '25/2', '8', '9']);
  });

  it('reports several independent balancings with dimension and basis, and fixed coefficients choose one', () => {
    const r = balance('C + O2 -> CO + CO2');
    expect(r.status).toBe('multiple');
    expect(r.dimension).toBe(2);
    expect(r.basis).toHaveLength(2);
    expect(r.basisTruncated).toBe(false);
    // C, O2, CO, CO2 written out by hand.
    const species: Array<Record<string, number>> = [{ C: 1 }, { O: 2 }, { C: 1, O: 1 }, { C: 1, O: 2 }];
    for (const v of r.basis!) expect(conservedWith(species, [1, 1, -1, -1], v)).toBe(true);
    expect(conservedWith(species, [1, 1, -1, -1], coefficients(r))).toBe(true);
    const chosen = balance('C + O2 -> CO + CO2', { fixed: { '2': '2', '3': '1' } });
    expect([chosen.status, coefficients(chosen)]).toEqual(['balanced', ['3', '2', '2', '1']]);
    const half = balance('C + O2 -> CO + CO2', { fixed: { '3': '1/2' } });
    expect(half.status).toBe('multiple');
    expect(half.dimension).toBe(1);
    expect(half.terms[3]!.coefficient).toBe('1/2');
  });

  it('says which element appears on one side only', () => {
    const r = balance('H2 + Cl2 -> HCl + O2');
    expect(r.status).toBe('impossible');
    expect(r.reason).toMatch(/Oxygen \(O\) appears only among the products/);
  });

  it('says when the charge cannot balance', () => {
    const r = balance('Fe -> Fe^2+');
    expect(r.status).toBe('impossible');
    expect(r.reason).toMatch(/charge cannot balance/);
  });

  it('says which species would have to change side', () => {
    // Only balancing: 2 H2O2 = 2 H2O + O2, so O2 on the left would need a negative coefficient.
    const r = balance('H2O2 + O2 -> H2O');
    expect(r.status).toBe('impossible');
    expect(r.reason).toMatch(/O2 \(term 1\) would have to change side/);
    expect(r.basis).toEqual([['2', '-1', '2']]);
  });

  it('says which species would have to vanish', () => {
    // H: 2a = 2b and O: a = b + 2c leave c = 0 for O2.
    const r = balance('H2O -> H2O + O2');
    expect(r.status).toBe('impossible');
    expect(r.reason).toBe('O2 (term 2) would have to vanish: every balancing gives it coefficient 0.');
    expect(balance('H2 + O2 + He -> H2O').reason).toMatch(/Helium \(He\) appears only among the reactants/);
  });

  it('says when only zero coefficients balance', () => {
    const r = balance('H2O -> H2O2');
    expect(r.status).toBe('impossible');
    expect(r.reason).toMatch(/all zero/);
    expect(r.dimension).toBe(0);
  });

  it('detects a family with no positive member (exact simplex check)', () => {
    // Kernel of dimension 2, no species always zero, but O balance needs 2x(O2) + 3x(O3) = −x(H2O):
    // no balancing has all coefficients positive (checked by hand).
    const r = balance('H2O2 + O2 + O3 -> H2O');
    expect(r.status).toBe('impossible');
    expect(r.dimension).toBe(2);
    expect(r.reason).toMatch(/change side/);
  });

  it('finds a positive member of a family when the basis vectors are not positive', () => {
    // Basis (free columns left to right) has negative entries; the sum is checked, then the exact LP.
    const r = balance('H2O + O2 -> H2O2 + O3 + H2');
    expect(r.status).toBe('multiple');
    expect(r.basis!.some((v) => v.some((x) => x.startsWith('-')))).toBe(true);
    const found = coefficients(r);
    expect(found.every((c) => /^[1-9]\d*$/.test(c))).toBe(true);
    // H2O, O2, H2O2, O3, H2 written out by hand: the example must conserve H and O.
    const species: Array<Record<string, number>> = [{ H: 2, O: 1 }, { O: 2 }, { H: 2, O: 2 }, { O: 3 }, { H: 2 }];
    expect(conservedWith(species, [1, 1, -1, -1, -1], found)).toBe(true);
  });

  it('drops ΔH with a warning when the answer is not a multiple of the typed equation', () => {
    const r = balance('H2 + O2 -> H2O, ΔH = -285.8 kJ');
    expect(r.enthalpy).toBeUndefined();
    expect(r.warnings.map((w) => w.code)).toContain('enthalpy_not_carried');
  });

  it('rejects bad fixed and normaliseTo fields with their field path', () => {
    const field = (extra: object): unknown => {
      try {
        balanceEquationText('C + O2 -> CO + CO2', extra);
      } catch (err) {
        expect(err).toBeInstanceOf(BalanceInputError);
        return ((err as BalanceInputError).details as { issues: Array<{ path: string[] }> }).issues[0]!.path;
      }
      return null;
    };
    expect(field({ fixed: { '7': '1' } })).toEqual(['body', 'fixed', '7']);
    expect(field({ fixed: { '1': '0' } })).toEqual(['body', 'fixed', '1']);
    expect(field({ fixed: { '1': '-2' } })).toEqual(['body', 'fixed', '1']);
    expect(field({ normaliseTo: 4 })).toEqual(['body', 'normaliseTo']);
    // C = 1 and CO = 2 cannot both hold (C atoms: 1 = 2 + x(CO2)).
    expect(field({ fixed: { '0': '1', '2': '2' } })).toEqual(['body', 'fixed', '2']);
  });

  it('throws EquationParseError for unreadable text', () => {
    expect(() => balanceEquationText('H2 + Qq -> H2')).toThrow(EquationParseError);
  });
});

describe('balanceEquationText — the model', () => {
  it('returns exact coefficients, the reading and the answer as data', () => {
    const b = balanceEquationText('C3H8(g) + O2(g) -> CO2(g) + H2O(l)');
    expect(b.status).toBe('balanced');
    // C3H8 + 5 O2 → 3 CO2 + 4 H2O (common practice, no source).
    expect(b.equation.terms.map((t) => text(t.coefficient))).toEqual(['1', '5', '3', '4']);
    expect(b.reading.terms.map((t) => text(t.coefficient))).toEqual(['1', '1', '1', '1']);
    expect(b.equation.terms[1]!.species).toBe(b.reading.terms[1]!.species);
    expect(b.reading.terms[1]!.species.span).toEqual({ start: 10, end: 12, column: 11 });
    expect(b.givenTotals!.map((row) => [row.element, text(row.reactants), text(row.products)])).toEqual([
      ['C', '3', '1'],
      ['H', '8', '2'],
      ['O', '2', '3'],
    ]);
  });

  it('gives the reason for an impossible equation as data with the words beside it', () => {
    const oneSide = balanceEquationText('H2 + Cl2 -> HCl + O2').impossible!;
    expect(oneSide).toMatchObject({ kind: 'one_side', elements: [{ element: 'O', side: 'product' }], charge: null });
    const charge = balanceEquationText('Fe -> Fe^2+').impossible!;
    expect(charge).toMatchObject({ kind: 'one_side', charge: { reactants: 'none', products: 'positive' } });
    expect(balanceEquationText('H2O2 + O2 -> H2O').impossible).toMatchObject({ kind: 'must_change_side', terms: [1] });
    // H: 2a = 2b, O: a = b + 2c, so O2 is 0 in the only balancing.
    expect(balanceEquationText('H2O -> H2O + O2').impossible).toMatchObject({ kind: 'must_vanish', terms: [2] });
    expect(balanceEquationText('H2O -> H2O2').impossible).toMatchObject({ kind: 'only_zero', conserved: ['H', 'O'] });
    expect(balanceEquationText('H2O2 + O2 + O3 -> H2O').impossible?.kind).toBe('no_positive_balancing');
    expect(balance('H2O2 + O2 -> H2O').impossible).toEqual({ code: 'must_change_side', terms: [1] });
  });

  it('keeps reading warnings apart from balancing warnings, and marks them on the wire', () => {
    const b = balanceEquationText('Fe3+ + O2 -> Fe3+ + O2, ΔH = 5 kJ');
    expect(b.reading.warnings.map((w) => w.code)).toEqual(['ambiguous_charge', 'ambiguous_charge']);
    expect(b.warnings.map((w) => w.code)).toEqual(['other_balancings']);
    expect(balance('Fe3+ + O2 -> Fe3+ + O2, ΔH = 5 kJ').warnings.map((w) => [w.code, w.stage])).toEqual([
      ['ambiguous_charge', 'reading'],
      ['ambiguous_charge', 'reading'],
      ['other_balancings', 'balancing'],
    ]);
  });
});

describe('balanceEquationText — fractional formula units', () => {
  it('balances the hemihydrate exactly, with fractional counts scaled per row', () => {
    // CaSO4·2H2O → CaSO4·½H2O + 3/2 H2O, i.e. 2 : 2 : 3 in whole numbers (common practice, no source).
    expect(coefficients(balance('CaSO4·2H2O(s) -> CaSO4·½H2O(s) + H2O(g)'))).toEqual(['2', '2', '3']);
    expect(coefficients(balance('CaSO4·0.5H2O + H2O -> CaSO4·2H2O'))).toEqual(['2', '3', '2']);
    expect(coefficients(balance('CaSO4·1/2H2O(s) -> CaSO4(s) + H2O(g)', { normaliseTo: 0 }))).toEqual([
      '1',
      '1',
      '1/2',
    ]);
    // The doubled unit written whole-number style balances the same way.
    expect(coefficients(balance('CaSO4·2H2O -> (CaSO4)2·H2O + H2O'))).toEqual(['2', '1', '3']);
  });

  it('keeps the typed coefficients when they balance with a fractional unit', () => {
    const r = balance('CaSO4·2H2O -> CaSO4·½H2O + 3/2 H2O');
    expect([r.status, r.asGiven, coefficients(r)]).toEqual(['balanced', true, ['1', '1', '3/2']]);
    expect(r.terms[1]!.composition).toEqual({ Ca: '1', S: '1', O: '9/2', H: '1' });
    expect(r.equation).toBe('CaSO4·2H2O -> CaSO4·1/2H2O + 3/2 H2O');
  });
});

describe('balanceEquationText — ΔH that cannot be scaled', () => {
  it('refuses a ΔH that overflows when normalised, naming normaliseTo, instead of answering Infinity', () => {
    let caught: unknown;
    try {
      // 1 mol of O2 doubles the equation as typed: 2 × 1.7e308 is beyond the largest double.
      balanceEquationText('H2 + 1/2 O2 -> H2O, ΔH = 1.7e308 kJ/mol', { normaliseTo: 1 });
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(BalanceInputError);
    expect((caught as BalanceInputError).field).toBe('normaliseTo');
    expect((caught as BalanceInputError).message).toMatch(/ΔH too large/);
  });

  it('names the fixed coefficient when that is what scales ΔH out of range', () => {
    expect(() => balanceEquationText('H2 + 1/2 O2 -> H2O, ΔH = -1.7e308 kJ', { fixed: { '1': '2' } })).toThrow(
      expect.objectContaining({ field: 'fixed.1' }),
    );
  });

  it('refuses a stated ΔH that is not finite in kJ as a parse error', () => {
    expect(() => balanceEquationText('H2 + O2 -> H2O2, ΔH = 1e308 kcal')).toThrow(EquationParseError);
    expect(() => balanceEquationText('H2 + O2 -> H2O2 + 1e308 kJ + 1e308 kJ')).toThrow(EquationParseError);
  });

  it('keeps a large but finite ΔH when it does not overflow', () => {
    expect(balance('H2 + 1/2 O2 -> H2O, ΔH = 1e300 kJ', { normaliseTo: 0 }).enthalpy?.value).toBe(1e300);
  });
});

describe('balanceEquationText — the basis limit', () => {
  it(`lists at most ${DEFAULT_WORK_LIMITS.maxBasisVectors} basis vectors, with the dimension, a flag and a warning`, () => {
    // 40 hydrocarbons burnt to CO2 and H2O: 43 terms, 3 independent conservation rows, so 40 balancings.
    const fuels = Array.from({ length: 40 }, (_, i) => `C${i + 1}H${2 * i + 4}`);
    const r = balance(`${fuels.join(' + ')} + O2 -> CO2 + H2O`);
    expect(r.status).toBe('multiple');
    expect(r.dimension).toBe(40);
    expect(r.basis).toHaveLength(DEFAULT_WORK_LIMITS.maxBasisVectors);
    expect(r.basisTruncated).toBe(true);
    expect(r.warnings.find((w) => w.code === 'basis_truncated')?.message).toMatch(
      /40 independent balancings.*first 20/,
    );
    const few = balanceEquationText(`${fuels.join(' + ')} + O2 -> CO2 + H2O`, { limits: { maxBasisVectors: 5 } });
    expect([few.dimension, few.basis.length, few.basisTruncated]).toEqual([40, 5, true]);
  });
});
