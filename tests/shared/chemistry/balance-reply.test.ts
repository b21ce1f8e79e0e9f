import { describe, expect, it } from 'vitest';
import { balanceEquationText, balanceRequest, toBalanceReply } from '@shared/chemistry';
import { balanceResultSchema } from '@shared/schemas/balance';

describe('toBalanceReply', () => {
  it('keeps every existing field with its meaning and adds the new ones', () => {
    // 2 H2 + O2 → 2 H2O (common practice, no source).
    const reply = toBalanceReply(balanceEquationText('H2(g) + O2(g) -> H2O(l)'));
    expect(balanceResultSchema.parse(reply)).toEqual(reply);
    expect(reply).toEqual({
      status: 'balanced',
      equation: '2 H2(g) + O2(g) -> 2 H2O(l)',
      terms: [
        {
          formula: 'H2',
          hill: 'H2',
          phase: 'g',
          descriptor: null,
          charge: 0,
          side: 'reactant',
          coefficient: '2',
          composition: { H: '2' },
        },
        {
          formula: 'O2',
          hill: 'O2',
          phase: 'g',
          descriptor: null,
          charge: 0,
          side: 'reactant',
          coefficient: '1',
          composition: { O: '2' },
        },
        {
          formula: 'H2O',
          hill: 'H2O',
          phase: 'l',
          descriptor: null,
          charge: 0,
          side: 'product',
          coefficient: '2',
          composition: { H: '2', O: '1' },
        },
      ],
      asGiven: false,
      givenImbalance: [
        { element: 'H', reactants: '2', products: '2' },
        { element: 'O', reactants: '2', products: '1' },
      ],
      dimension: 1,
      warnings: [],
    });
  });

  it('writes exact fractions as text and the basis as whole numbers', () => {
    const r = balanceRequest({ equation: 'C + O2 -> CO + CO2', normaliseTo: 0 });
    // The example 3 C + 2 O2 → 2 CO + CO2 per mole of C (C: 1 = 2/3 + 1/3; O: 4/3 = 2/3 + 2/3, by hand).
    expect(r.terms.map((t) => t.coefficient)).toEqual(['1', '2/3', '2/3', '1/3']);
    expect(r.basis).toEqual([
      ['2', '1', '2', '0'],
      ['1', '1', '0', '1'],
    ]);
    expect(r.basisTruncated).toBe(false);
  });

  it('writes the equilibrium arrow as typed', () => {
    expect(balanceRequest({ equation: 'N2 + H2 <=> NH3' }).equation).toBe('N2 + 3 H2 <=> 2 NH3');
  });

  it('gives ΔH in kJ/mol with its uncertainty when it carries over', () => {
    const r = balanceRequest({ equation: 'H2 + 1/2 O2 -> H2O, ΔH = -285.83 ± 0.04 kJ/mol', normaliseTo: 1 });
    // Twice the formation reaction: ΔH doubles, and so does its uncertainty.
    expect(r.enthalpy).toEqual({ value: -571.66, unit: 'kJ/mol', uncertainty: 0.08 });
  });
});
