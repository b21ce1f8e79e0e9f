import { describe, expect, it } from 'vitest';
import {
  formatFixed,
  formatSignificant,
  formatTemperature,
  roundToUncertainty,
  uncertaintyPlace,
} from '@/lib/uncertainty-rounding';

const M = '\u2212';

describe('roundToUncertainty', () => {
  it('keeps the GUM worked example of a mass standard: 100.021 47 g with u = 0.35 mg', () => {
    // JCGM 100:2008 (GUM) §7.2.2: "m_S = 100,021 47 g with u_c = 0,35 mg" — two significant digits of u
    // and the value to the same place (from memory of the GUM's text).
    expect(roundToUncertainty(100.02147, 0.00035)).toEqual({ value: '100.02147', uncertainty: '0.00035', decimals: 5 });
  });

  it('rounds the value to the last digit of u: 10.057 62 Ω with u = 27 mΩ gives 10.058 Ω', () => {
    // JCGM 100:2008 §7.2.6: "if y = 10,057 62 Ω with u_c(y) = 27 mΩ, y should be rounded to 10,058 Ω" (from memory).
    expect(roundToUncertainty(10.05762, 0.027)).toEqual({ value: '10.058', uncertainty: '0.027', decimals: 3 });
  });

  it('rounds u to the nearest digit: 28.05 kHz becomes 28 kHz', () => {
    // JCGM 100:2008 §7.2.6: "u(x_i) = 28,05 kHz should be rounded down to 28 kHz" (from memory).
    expect(roundToUncertainty(1234.567, 28.05)).toEqual({ value: '1235', uncertainty: '28', decimals: 0 });
  });

  it('rounds CODATA CO2(g) with u = 0.065 kJ/mol to three decimals', () => {
    // CODATA Key Values 1989: ΔfH°(CO2, g) = −393.51 ± 0.13 kJ/mol, u = 0.13/2 by the interval rule (from memory).
    expect(roundToUncertainty(-393.51, 0.065)).toEqual({ value: `${M}393.510`, uncertainty: '0.065', decimals: 3 });
  });

  it('moves one place coarser when u rounds up to a third digit (0.0996 → 0.10)', () => {
    // Two significant digits of 0.0996 are 0.10, not 0.100 (common practice, no source).
    expect(uncertaintyPlace(0.0996)).toBe(-2);
    expect(roundToUncertainty(5.12345, 0.0996)).toEqual({ value: '5.12', uncertainty: '0.10', decimals: 2 });
  });

  it('rounds to tens and hundreds when u is large', () => {
    expect(roundToUncertainty(12345.6, 1234)).toEqual({ value: '12300', uncertainty: '1200', decimals: 0 });
  });

  it('rounds halves away from zero without binary drift', () => {
    // 1.005 is stored as 1.00499999999999989…; the decimal shift keeps the half (common practice, no source).
    expect(roundToUncertainty(1.005, 0.012)?.value).toBe('1.005');
    expect(roundToUncertainty(1.0045, 0.01)?.value).toBe('1.005');
    expect(roundToUncertainty(-2.345, 0.011)?.value).toBe(`${M}2.345`);
    expect(roundToUncertainty(-2.3455, 0.011)?.value).toBe(`${M}2.346`);
  });

  it('never shows a negative zero', () => {
    expect(roundToUncertainty(-0.0004, 0.012)?.value).toBe('0.000');
  });

  it('returns null without a usable uncertainty (shown as printed, marked not stated)', () => {
    expect(roundToUncertainty(-424.7262, null)).toBeNull();
    expect(roundToUncertainty(-424.7262, 0)).toBeNull();
    expect(roundToUncertainty(-424.7262, Number.NaN)).toBeNull();
  });
});

describe('number formatting helpers', () => {
  it('writes a true minus sign', () => {
    expect(formatFixed(-3.14159, 2)).toBe(`${M}3.14`);
    expect(formatFixed(2, 1)).toBe('2.0');
  });

  it('keeps significant digits and a minimum of decimals', () => {
    expect(formatSignificant(-3.102265, 4)).toBe(`${M}3.102`);
    expect(formatSignificant(484.5, 6, 2)).toBe('484.500');
    expect(formatSignificant(0, 3, 1)).toBe('0.0');
  });

  it('writes temperatures with at most two decimals', () => {
    expect(formatTemperature(298.15)).toBe('298.15');
    expect(formatTemperature(350)).toBe('350');
    expect(formatTemperature(516.0000001)).toBe('516');
  });
});
