import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { effectScope, nextTick, ref } from 'vue';
import { useEquationInput, type BalanceOptions } from '@/composables/use-equation-input';

const balancedReply = {
  status: 'balanced',
  equation: '2 H2 + O2 -> 2 H2O',
  terms: [
    { formula: 'H2', hill: 'H2', phase: null, descriptor: null, charge: 0, side: 'reactant', coefficient: '2' },
    { formula: 'O2', hill: 'O2', phase: null, descriptor: null, charge: 0, side: 'reactant', coefficient: '1' },
    { formula: 'H2O', hill: 'H2O', phase: null, descriptor: null, charge: 0, side: 'product', coefficient: '2' },
  ],
  asGiven: false,
  warnings: [],
};

function setUp(initial: string) {
  const text = ref(initial);
  const options = ref<BalanceOptions>({ fixed: {}, normaliseTo: null });
  const scope = effectScope();
  const input = scope.run(() => useEquationInput(text, options, 300))!;
  return { text, options, input, stop: () => scope.stop() };
}

describe('useEquationInput', () => {
  const fetchMock = vi.fn<typeof fetch>();
  beforeEach(() => {
    vi.useFakeTimers();
    fetchMock.mockReset();
    vi.stubGlobal('fetch', fetchMock);
  });
  afterEach(() => {
    vi.useRealTimers();
    vi.unstubAllGlobals();
  });

  it('marks a parse error at once and sends nothing', async () => {
    const { input, stop } = setUp('H2 + Xx2 -> H2O');
    expect(input.problem.value).toMatchObject({ line: 1, column: 6, length: 2 });
    expect(input.problem.value?.message).toMatch(/Xx/);
    await vi.advanceTimersByTimeAsync(1000);
    expect(fetchMock).not.toHaveBeenCalled();
    stop();
  });

  it('waits for a pause in typing, then sends one request with the latest text', async () => {
    fetchMock.mockResolvedValue(new Response(JSON.stringify(balancedReply), { status: 200 }));
    const { text, input, stop } = setUp('H2 + O2 -> H2O');
    await vi.advanceTimersByTimeAsync(100);
    text.value = 'H2 + O2 -> H2O ';
    await nextTick();
    await vi.advanceTimersByTimeAsync(100);
    text.value = 'H2 + O2 -> H2O';
    await nextTick();
    expect(fetchMock).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(400);
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(JSON.parse(String(fetchMock.mock.calls[0]![1]?.body))).toEqual({ equation: 'H2 + O2 -> H2O' });
    expect(input.result.value?.equation).toBe('2 H2 + O2 -> 2 H2O');
    // The reply is kept with the reading it answers.
    expect(input.outcome.value?.reading.source).toBe('H2 + O2 -> H2O');
    expect(input.computedLocally.value).toBe(false);
    stop();
  });

  it('sends fixed coefficients and the normalising term', async () => {
    fetchMock.mockResolvedValue(new Response(JSON.stringify(balancedReply), { status: 200 }));
    const { options, stop } = setUp('H2 + O2 -> H2O');
    options.value = { fixed: { '0': '1' }, normaliseTo: 2 };
    await nextTick();
    await vi.advanceTimersByTimeAsync(400);
    expect(JSON.parse(String(fetchMock.mock.calls.at(-1)![1]?.body))).toEqual({
      equation: 'H2 + O2 -> H2O',
      fixed: { '0': '1' },
      normaliseTo: 2,
    });
    stop();
  });

  it('balances in the browser when the server cannot be reached', async () => {
    fetchMock.mockRejectedValue(new TypeError('Failed to fetch'));
    const { input, stop } = setUp('C3H8 + O2 -> CO2 + H2O');
    await vi.advanceTimersByTimeAsync(400);
    // Propane combustion, C3H8 + 5 O2 -> 3 CO2 + 4 H2O (common practice, no source).
    expect(input.result.value?.equation).toBe('C3H8 + 5 O2 -> 3 CO2 + 4 H2O');
    expect(input.computedLocally.value).toBe(true);
    stop();
  });

  it('balances locally with the fixed coefficients and normalising term too', async () => {
    fetchMock.mockRejectedValue(new TypeError('Failed to fetch'));
    const { options, input, stop } = setUp('C + O2 -> CO + CO2');
    options.value = { fixed: { '2': '2', '3': '1' }, normaliseTo: 0 };
    await nextTick();
    await vi.advanceTimersByTimeAsync(400);
    // 3 C + 2 O2 → 2 CO + CO2 per mole of C (C: 3 = 2 + 1; O: 4 = 2 + 2).
    expect(input.result.value?.terms.map((t) => t.coefficient)).toEqual(['1', '2/3', '2/3', '1/3']);
    stop();
  });

  it('shows a refused option with its field', async () => {
    const envelope = {
      error: {
        code: 'validation_failed',
        message: 'There is no term 7.',
        details: { issues: [{ path: ['body', 'normaliseTo'], message: 'There is no term 7.' }] },
      },
    };
    fetchMock.mockResolvedValue(new Response(JSON.stringify(envelope), { status: 400 }));
    const { input, stop } = setUp('H2 + O2 -> H2O');
    await vi.advanceTimersByTimeAsync(400);
    expect(input.result.value).toBeNull();
    expect(input.requestError.value).toBe('There is no term 7.');
    expect(input.optionErrors.value).toEqual({ normaliseTo: 'There is no term 7.' });
    stop();
  });
});
