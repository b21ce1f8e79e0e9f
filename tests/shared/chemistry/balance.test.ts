import { describe, expect, it } from 'vitest';
import {
  BalanceInputError,
  balanceEquationText,
  EquationParseError,
  elementBalanceTable,
  parseEquation,
} from '@shared/chemistry';
import type { BalanceResult } from '@shared/chemistry';
import { balanceResultSchema } from '@shared/schemas/balance';

const coefficients = (r: BalanceResult): string[] => r.terms.map((t) => t.coefficient);
const balance = (equation: string, extra: object = {}): BalanceResult => {
  const r = balanceEquationText({ equation, ...extra });
  expect(balanceResultSchema.safeParse(r).success).toBe(true); // the public API shape
  return r;
};

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
    for (const v of r.basis!) {
      const table = elementBalanceTable(
        r.terms.map((t, j) => ({
          composition: parseEquation('C + O2 -> CO + CO2').terms[j]!.species.composition,
          charge: 0,
          side: t.side,
          coefficient: v[j]!,
        })),
      );
      expect(table.every((row) => row.reactants === row.products)).toBe(true);
    }
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
    const r = balance('H2 + O2 + He -> H2O');
    expect(r.status).toBe('impossible');
    expect(r.reason).toMatch(/He/);
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
    expect(r.terms.every((t) => /^\d+$/.test(t.coefficient) && t.coefficient !== '0')).toBe(true);
  });

  it('drops ΔH with a warning when the answer is not a multiple of the typed equation', () => {
    const r = balance('H2 + O2 -> H2O, ΔH = -285.8 kJ');
    expect(r.enthalpy).toBeUndefined();
    expect(r.warnings.map((w) => w.code)).toContain('enthalpy_not_carried');
  });

  it('rejects bad fixed and normaliseTo fields with their field path', () => {
    const field = (extra: object): unknown => {
      try {
        balanceEquationText({ equation: 'C + O2 -> CO + CO2', ...extra });
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
    expect(() => balanceEquationText({ equation: 'H2 + Qq -> H2' })).toThrow(EquationParseError);
  });
});
