import { describe, expect, it } from 'vitest';
import { balanceEquationText, formatEquation, parseEquation } from '@shared/chemistry/index';
import {
  balanceRows,
  displayedEquation,
  formatWithUncertainty,
  molarMassRows,
  readFactor,
  smallestWholeNumbers,
  statusSummary,
} from '@/lib/workbench-view';

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

describe('displayedEquation', () => {
  // 2 H2(g) + O2(g) -> 2 H2O(l), ΔrH° = -571.66 kJ/mol: twice ΔfH°(H2O, l) = -285.83 kJ/mol (CODATA 1989 key values, from memory).
  const result = balanceEquationText({ equation: '2 H2(g) + O2(g) -> 2 H2O(l); ΔH = -571.66 kJ' });

  it('shows the balanced equation unchanged by default', () => {
    const model = displayedEquation(result, { reversed: false, factor: '1' })!;
    expect(formatEquation({ ...model, enthalpy: null }, 'text')).toBe('2 H2(g) + O2(g) -> 2 H2O(l)');
    expect(model.enthalpy?.value).toBeCloseTo(-571.66, 10);
  });

  it('flips the sign of ΔH when reversed and scales it with the coefficients', () => {
    const model = displayedEquation(result, { reversed: true, factor: '1/2' })!;
    expect(formatEquation({ ...model, enthalpy: null }, 'text')).toBe('H2O(l) -> H2(g) + 1/2 O2(g)');
    expect(model.enthalpy?.value).toBeCloseTo(285.83, 10);
  });

  it('keeps an equilibrium arrow', () => {
    const eq = balanceEquationText({ equation: 'N2 + H2 <=> NH3' });
    expect(formatEquation(displayedEquation(eq, { reversed: false, factor: '1' }, true)!, 'text')).toBe(
      'N2 + 3 H2 <=> 2 NH3',
    );
  });

  it('shows nothing for several balancings or none', () => {
    expect(
      displayedEquation(balanceEquationText({ equation: 'H2 + O2 -> H2O + H2O2' }), { reversed: false, factor: '1' }),
    ).toBeNull();
  });
});

describe('statusSummary', () => {
  it('names each outcome', () => {
    expect(statusSummary(balanceEquationText({ equation: '2 H2 + O2 -> 2 H2O' }))).toMatchObject({
      tone: 'success',
      label: 'Balanced as written',
    });
    expect(statusSummary(balanceEquationText({ equation: 'H2 + O2 -> H2O + H2O2' }))).toMatchObject({
      tone: 'warning',
      label: 'Several balancings (2 independent)',
    });
    const impossible = statusSummary(balanceEquationText({ equation: 'H2 -> O2' }));
    expect(impossible.tone).toBe('error');
    expect(impossible.detail.length).toBeGreaterThan(0);
  });
});

describe('smallestWholeNumbers', () => {
  it('is true only for whole numbers without a common factor', () => {
    expect(smallestWholeNumbers(['1', '5', '3', '4'])).toBe(true);
    expect(smallestWholeNumbers(['2', '10', '6', '8'])).toBe(false);
    expect(smallestWholeNumbers(['1/2', '1', '1/2', '1'])).toBe(false);
  });
});

describe('balanceRows', () => {
  it('flags the elements whose sides differ as written', () => {
    const rows = balanceRows(parseEquation('H2 + O2 -> H2O').terms);
    expect(rows).toEqual([
      { element: 'H', reactants: '2', products: '2', mismatch: false },
      { element: 'O', reactants: '2', products: '1', mismatch: true },
    ]);
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
