// @vitest-environment happy-dom
import { mount } from '@vue/test-utils';
import { describe, expect, it } from 'vitest';
import { balanceRequest, parseEquation } from '@shared/chemistry/index';
import ElementBalanceTable from '@/components/equations/ElementBalanceTable.vue';
import SpeciesTable from '@/components/equations/SpeciesTable.vue';
import { answerModel, balanceRows } from '@/lib/workbench-view';

const cells = (row: { findAll: (s: string) => Array<{ text: () => string }> }): string[] =>
  row.findAll('th, td').map((c) => c.text());

describe('ElementBalanceTable', () => {
  it('lists each element with its totals and marks the sides that differ', () => {
    const rows = balanceRows(parseEquation('Fe^3+ + e- -> Fe^2+ + H2').terms);
    const wrapper = mount(ElementBalanceTable, { props: { rows, caption: 'Balance as written' } });
    expect(wrapper.get('caption').text()).toBe('Balance as written');
    const body = wrapper.findAll('tbody tr');
    expect(body.map(cells)).toEqual([
      ['Fe', '1', '1', '='],
      ['H', '0', '2', '≠'],
      ['Charge', '2', '2', '='],
    ]);
    expect(body[1]!.classes()).toContain('mismatch');
    expect(body[2]!.classes()).toContain('charge');
  });

  it('shows exact fractional totals', () => {
    const rows = balanceRows(parseEquation('CaSO4·½H2O -> CaSO4 + 1/2 H2O').terms);
    const wrapper = mount(ElementBalanceTable, { props: { rows, caption: 'x' } });
    expect(wrapper.findAll('tbody tr').map(cells)).toContainEqual(['O', '9/2', '9/2', '=']);
  });
});

describe('SpeciesTable', () => {
  it('shows each species with its Hill formula, exact coefficient and molar mass', () => {
    const equation = 'CaSO4·2H2O(s) -> CaSO4·½H2O(s) + H2O(g)';
    const model = answerModel({ reading: parseEquation(equation), reply: balanceRequest({ equation }) })!;
    const wrapper = mount(SpeciesTable, { props: { terms: model.terms } });
    const rows = wrapper.findAll('tbody tr').map(cells);
    // 2 CaSO4·2H2O → 2 CaSO4·½H2O + 3 H2O (common practice, no source). M(CaSO4·½H2O) from the CIAAW 2021
    // conventional weights by hand: 40.078 + 32.06 + 4.5 × 15.999 + 1.008 = 145.1415 g/mol.
    expect(rows.map((r) => [r[1], r[2]])).toEqual([
      ['CaH4O6S', '2'],
      ['CaHO4.5S', '2'],
      ['H2O', '3'],
    ]);
    expect(rows[1]![3]).toMatch(/^145\.142 ± /);
    expect(wrapper.findAll('tbody th')[1]!.html()).toContain('CaSO<sub>4</sub>·½H<sub>2</sub>O');
  });

  it('shows a charge beside the Hill formula and no mass for the electron', () => {
    const wrapper = mount(SpeciesTable, { props: { terms: parseEquation('Fe^3+ + e- -> Fe^2+').terms } });
    const rows = wrapper.findAll('tbody tr').map(cells);
    expect(rows[0]![1]).toBe('Fe (+3)');
    expect(rows[1]![3]).toBe('—');
  });
});
