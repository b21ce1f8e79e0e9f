// @vitest-environment happy-dom
import { describe, expect, it } from 'vitest';
import { mount, RouterLinkStub } from '@vue/test-utils';
import ContributionsTable from '@/components/enthalpy/ContributionsTable.vue';
import UncertaintyIncomplete from '@/components/enthalpy/UncertaintyIncomplete.vue';
import { contributionRows, shareText } from '@/lib/contribution-rows';
import { esterification, ids } from './fixtures-enthalpy';

const provenance = (id: string) => (id === ids.water ? ('checked' as const) : ('memory' as const));

function mountTable(temperature = 298.15) {
  const result = esterification();
  return mount(ContributionsTable, {
    props: { rows: contributionRows(result, provenance), temperature, revision: null },
    global: { stubs: { RouterLink: RouterLinkStub } },
  });
}

describe('ContributionsTable', () => {
  it('lists each species with ν, ΔfH° ± u, source, provenance, ν·ΔfH° and its variance share', () => {
    const wrapper = mountTable();
    const rows = wrapper.findAll('[data-testid="contribution-row"]');
    expect(rows.map((r) => r.attributes('data-key'))).toEqual(['CH3COOH(l)', 'C2H6O(l)', 'C4H8O2(l)', 'H2O(l)']);
    const cells = rows[2]!.findAll('td').map((c) => c.text());
    // Ethyl acetate: ν = +1, −479.3 ± 0.4 kJ/mol (Pedley 1986, from memory in the seed), ν·ΔfH° = −479.3.
    expect(cells[0]).toBe('+1');
    expect(cells[1]).toContain('\u2212479.30 ± 0.40');
    expect(cells[2]).toContain('Pedley, Naylor & Kirby');
    expect(cells[3]).toContain('typed from memory');
    expect(cells[4]).toBe('\u2212479.30');
    // Its share of the variance: 0.16 / 0.2229 = 71.8 % (hand calculation), written out, not only drawn.
    expect(cells[5]).toBe('71.8 %');
    expect(rows[0]!.findAll('td')[0]!.text()).toBe('\u22121');
    expect(rows[3]!.findAll('td')[5]!.text()).toBe('0.2 %');
    expect(rows[3]!.find('[data-provenance="checked"]').exists()).toBe(true);
  });

  it('draws each bar as wide as its share', () => {
    const widths = mountTable()
      .findAll('.fill')
      .map((f) => f.attributes('style'));
    expect(widths).toEqual(['width: 18%;', 'width: 10%;', 'width: 72%;', 'width: 0%;']);
  });

  it('links each species to its library page', () => {
    const links = mountTable().findAllComponents(RouterLinkStub);
    expect(links[0]!.props('to')).toMatchObject({ name: 'library-species', params: { speciesId: ids.acid } });
  });

  it('adds ν·H°(T) only away from 298.15 K', () => {
    expect(mountTable().text()).not.toContain('ν·H°(T)');
    expect(mountTable(350).text()).toContain('ν·H°(T)');
  });

  it('says "not stated" for a value without uncertainty', () => {
    const result = esterification();
    result.contributions[3] = { ...result.contributions[3]!, uncertainty: null, varianceShare: null };
    const wrapper = mount(ContributionsTable, {
      props: { rows: contributionRows(result, provenance), temperature: 298.15, revision: 1 },
      global: { stubs: { RouterLink: RouterLinkStub } },
    });
    expect(wrapper.findAll('[data-testid="contribution-row"]')[3]!.text()).toContain('not stated');
    expect(shareText(0.0004)).toBe('< 0.1 %');
  });
});

describe('UncertaintyIncomplete', () => {
  it('says the uncertainty is incomplete and names every species without one', () => {
    const wrapper = mount(UncertaintyIncomplete, { props: { missing: ['KOH(cr)', 'H2O(l)'] } });
    const text = wrapper.text();
    expect(text).toContain('Uncertainty incomplete.');
    expect(text).toContain('no uncertainty is stated for KOH(cr) and H2O(l)');
    expect(text).toMatch(/larger than shown/);
    expect(wrapper.attributes('role')).toBe('note');
  });

  it('still says so when the reply names no species', () => {
    const wrapper = mount(UncertaintyIncomplete, { props: { missing: [] } });
    expect(wrapper.text()).toContain('no uncertainty is stated for some of the values used');
  });
});

describe('ContributionsTable with an element in its reference state', () => {
  it('shows ΔfH° = 0 as exact, not as a value without uncertainty', () => {
    const result = esterification();
    result.terms[3] = { ...result.terms[3]!, deltaFH: { value: 0, uncertainty: 0 } };
    result.contributions[3] = { ...result.contributions[3]!, contribution: 0, uncertainty: 0, varianceShare: 0 };
    const wrapper = mount(ContributionsTable, {
      props: { rows: contributionRows(result, provenance), temperature: 298.15, revision: null },
      global: { stubs: { RouterLink: RouterLinkStub } },
    });
    const row = wrapper.findAll('[data-testid="contribution-row"]')[3]!;
    expect(row.text()).toContain('(reference state, exact)');
    expect(row.text()).not.toContain('not stated');
  });
});
