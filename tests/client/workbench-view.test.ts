import { describe, expect, it } from 'vitest';
import { balanceRequest, formatEquation, parseEquation, rat } from '@shared/chemistry/index';
import {
  answerModel,
  balanceRows,
  displayedEquation,
  formatWithUncertainty,
  molarMassRows,
  readFactor,
  smallestWholeNumbers,
  statusSummary,
  type BalanceOutcome,
} from '@/lib/workbench-view';

/** A reading and the reply for it, as the equation field holds them. */
const outcome = (equation: string): BalanceOutcome => ({
  reading: parseEquation(equation),
  reply: balanceRequest({ equation }),
});

describe('readFactor', () => {
  it('accepts exact positive numbers and writes them canonically', () => {
    expect(readFactor('1/2')).toEqual({ ok: true, value: '1/2' });
    expect(readFactor('0.25')).toEqual({ ok: true, value: '1/4' });
    expect(readFactor('3')).toEqual({ ok: true, value: '3' });
  });
  it('refuses zero, negatives and junk with a reason', () => {
    expect(readFactor('0')).toMatchObject({ ok: false, message: expect.stringMatching(/greater than zero/) });
    expect(readFactor('-2')).toMatchObject({ ok: false });
    expect(readFactor('half')).toMatchObject({ ok: false, message: expect.stringMatching(/exact number/) });
  });
});

describe('answerModel', () => {
  it("puts the reply's exact coefficients on the reading's species", () => {
    const model = answerModel(outcome('CaSO4·2H2O(s) -> CaSO4·½H2O(s) + H2O(g)'))!;
    expect(formatEquation(model, 'unicode')).toBe('2 CaSO₄·2H₂O(s) → 2 CaSO₄·½H₂O(s) + 3 H₂O(g)');
  });
  it('refuses a reply that belongs to other terms', () => {
    expect(
      answerModel({ reading: parseEquation('H2 + O2 -> H2O'), reply: balanceRequest({ equation: 'N2 -> N2' }) }),
    ).toBeNull();
  });
});

describe('displayedEquation', () => {
  // 2 H2(g) + O2(g) -> 2 H2O(l), ΔrH° = -571.66 kJ/mol: twice ΔfH°(H2O, l) = -285.83 kJ/mol (CODATA 1989 key values, from memory).
  const water = outcome('2 H2(g) + O2(g) -> 2 H2O(l); ΔH = -571.66 kJ');

  it('shows the balanced equation unchanged by default', () => {
    const model = displayedEquation(water, { reversed: false, factor: '1' })!;
    expect(formatEquation({ ...model, enthalpy: null }, 'text')).toBe('2 H2(g) + O2(g) -> 2 H2O(l)');
    expect(model.enthalpy?.value).toBeCloseTo(-571.66, 10);
  });

  it('flips the sign of ΔH when reversed and scales it with the coefficients', () => {
    const model = displayedEquation(water, { reversed: true, factor: '1/2' })!;
    expect(formatEquation({ ...model, enthalpy: null }, 'text')).toBe('H2O(l) -> H2(g) + 1/2 O2(g)');
    expect(model.enthalpy?.value).toBeCloseTo(285.83, 10);
  });

  it('keeps an equilibrium arrow from the reading', () => {
    expect(
      formatEquation(displayedEquation(outcome('N2 + H2 <=> NH3'), { reversed: false, factor: '1' })!, 'text'),
    ).toBe('N2 + 3 H2 <=> 2 NH3');
  });

  it('shows nothing for several balancings or none', () => {
    expect(displayedEquation(outcome('H2 + O2 -> H2O + H2O2'), { reversed: false, factor: '1' })).toBeNull();
  });
});

describe('statusSummary', () => {
  it('names each outcome', () => {
    expect(statusSummary(balanceRequest({ equation: '2 H2 + O2 -> 2 H2O' }))).toMatchObject({
      tone: 'success',
      label: 'Balanced as written',
    });
    expect(statusSummary(balanceRequest({ equation: 'H2 + O2 -> H2O' })).detail).toMatch(/Smallest whole-number/);
    expect(statusSummary(balanceRequest({ equation: 'H2 + O2 -> H2O', normaliseTo: 2 })).detail).toMatch(/^Exact/);
    expect(statusSummary(balanceRequest({ equation: 'H2 + O2 -> H2O + H2O2' }))).toMatchObject({
      tone: 'warning',
      label: 'Several balancings (2 independent)',
    });
    const impossible = statusSummary(balanceRequest({ equation: 'H2 -> O2' }));
    expect(impossible.tone).toBe('error');
    expect(impossible.detail.length).toBeGreaterThan(0);
  });
});

describe('smallestWholeNumbers', () => {
  it('is true only for whole numbers without a common factor', () => {
    const r = (...values: Array<[bigint, bigint] | bigint>) =>
      values.map((v) => (Array.isArray(v) ? rat(v[0], v[1]) : rat(v)));
    expect(smallestWholeNumbers(r(1n, 5n, 3n, 4n))).toBe(true);
    expect(smallestWholeNumbers(r(2n, 10n, 6n, 8n))).toBe(false);
    expect(smallestWholeNumbers(r([1n, 2n], 1n, [1n, 2n], 1n))).toBe(false);
  });
});

describe('balanceRows', () => {
  it('flags the elements whose sides differ as written', () => {
    expect(balanceRows(parseEquation('H2 + O2 -> H2O').terms)).toEqual([
      { element: 'H', reactants: '2', products: '2', mismatch: false },
      { element: 'O', reactants: '2', products: '1', mismatch: true },
    ]);
  });
  it('writes fractional totals exactly', () => {
    expect(balanceRows(parseEquation('CaSO4·½H2O -> CaSO4 + H2O').terms).find((r) => r.element === 'O')).toEqual({
      element: 'O',
      reactants: '9/2',
      products: '5',
      mismatch: true,
    });
  });
});

describe('formatWithUncertainty', () => {
  it('rounds the uncertainty to two significant digits and the value to match', () => {
    expect(formatWithUncertainty(18.01528, 0.00033)).toBe('18.01528 ± 0.00033');
    expect(formatWithUncertainty(44.0095, 0.00104)).toBe('44.0095 ± 0.0010');
    expect(formatWithUncertainty(1234.5678, 2.3)).toBe('1234.6 ± 2.3');
  });
});

describe('molarMassRows', () => {
  it('leaves the electron out and gives water about 18.015 g/mol', () => {
    // M(H2O) = 18.015 g/mol (CIAAW 2021 conventional weights, H 1.008, O 15.999; from memory).
    const rows = molarMassRows(parseEquation('H2O + e- -> OH- + 1/2 H2').terms);
    expect(rows[0]!.text).toMatch(/^18\.015/);
    expect(rows[1]!.text).toBeNull();
  });
});
