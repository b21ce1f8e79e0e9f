// @vitest-environment happy-dom
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { balanceBatchRequest } from '@shared/chemistry/index';
import BatchPanel from '@/components/equations/BatchPanel.vue';

/** The server's answer to a batch request body, built by the same adapter the route uses. */
function serverReply(init?: RequestInit): Response {
  const { text } = JSON.parse(String(init?.body)) as { text: string };
  return new Response(JSON.stringify(balanceBatchRequest({ text })), {
    status: 200,
    headers: { 'content-type': 'application/json' },
  });
}

async function runWith(text: string) {
  const wrapper = mount(BatchPanel);
  await wrapper.get('[data-testid="batch-input"] textarea').setValue(text);
  await wrapper.get('[data-testid="batch-run"]').trigger('click');
  // The batch yields to the browser between chunks.
  await vi.waitFor(() => expect(wrapper.find('[data-testid="batch-summary"]').exists()).toBe(true));
  await flushPromises();
  return wrapper;
}

const rowsOf = (wrapper: Awaited<ReturnType<typeof runWith>>): string[][] =>
  wrapper.findAll('[data-testid="batch-row"]').map((tr) => tr.findAll('td').map((td) => td.text()));

describe('BatchPanel', () => {
  const fetchMock = vi.fn<typeof fetch>();
  beforeEach(() => {
    setActivePinia(createPinia());
    fetchMock.mockReset();
    vi.stubGlobal('fetch', fetchMock);
  });
  afterEach(() => vi.unstubAllGlobals());

  it('balances pasted lines on the server and reports each by its own line number', async () => {
    fetchMock.mockImplementation(async (_url, init) => serverReply(init));
    const wrapper = await runWith(['CH4 + O2 -> CO2 + H2O', '', 'H2 + Xx2 -> H2O', 'C + O2 -> CO + CO2'].join('\n'));
    expect(fetchMock).toHaveBeenCalledTimes(1);
    // Methane combustion: CH4 + 2 O2 → CO2 + 2 H2O (common practice, no source).
    expect(rowsOf(wrapper)).toEqual([
      ['1', 'CH4 + O2 -> CO2 + H2O', 'balanced', 'CH4 + 2 O2 → CO2 + 2 H2O'],
      ['3', 'H2 + Xx2 -> H2O', 'unreadable', "line 3, column 6: Unknown element symbol 'Xx'"],
      ['4', 'C + O2 -> CO + CO2', 'several', '2 independent balancings; fix coefficients on the workbench'],
    ]);
    const summary = wrapper.get('[data-testid="batch-summary"]').text();
    expect(summary).toContain('3 lines:');
    expect(summary).toContain('1 balanced');
    expect(summary).toContain('1 unreadable');
    expect(summary).not.toContain('computed in this browser');
  });

  it('balances in the browser when the server cannot be reached, and says so', async () => {
    fetchMock.mockRejectedValue(new TypeError('Failed to fetch'));
    const wrapper = await runWith('Fe2O3 + CO -> Fe + CO2');
    // Haematite reduced by CO: Fe2O3 + 3 CO → 2 Fe + 3 CO2 (common practice, no source).
    expect(rowsOf(wrapper)).toEqual([['1', 'Fe2O3 + CO -> Fe + CO2', 'balanced', 'Fe2O3 + 3 CO → 2 Fe + 3 CO2']]);
    expect(wrapper.get('[data-testid="batch-summary"]').text()).toContain('computed in this browser');
  });

  it('shows a line over the term limit with the limit in words', async () => {
    fetchMock.mockImplementation(async (_url, init) => serverReply(init));
    const wrapper = await runWith(`${Array.from({ length: 90 }, () => 'H').join(' + ')} -> H2`);
    expect(rowsOf(wrapper)[0]!.slice(2)).toEqual(['unreadable', 'This equation has 91 terms; the limit is 80.']);
  });

  it('asks for at least one equation instead of sending nothing', async () => {
    const wrapper = mount(BatchPanel);
    await wrapper.get('[data-testid="batch-input"] textarea').setValue('# only a comment\n\n');
    await wrapper.get('[data-testid="batch-run"]').trigger('click');
    await flushPromises();
    expect(fetchMock).not.toHaveBeenCalled();
    expect(wrapper.text()).toContain('Paste or upload at least one equation');
  });
});
