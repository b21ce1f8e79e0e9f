import { describe, expect, it } from 'vitest';
import { convertEnergy, energyUnitText, fractionValue, kelvinFrom, kelvinTo } from '@/lib/reaction-units';

describe('convertEnergy', () => {
  it('uses the thermochemical calorie, 4.184 J exactly', () => {
    // 1 cal_th = 4.184 J by definition (NIST SP 811, appendix B; from memory).
    const one = convertEnergy(4.184, 0.4184, { unit: 'kcal/mol' });
    expect(one.value).toBeCloseTo(1, 12);
    expect(one.uncertainty).toBeCloseTo(0.1, 12);
    // Methane combustion −890.3 kJ/mol ÷ 4.184 = −212.787 kcal/mol (hand calculation).
    expect(convertEnergy(-890.3, null, { unit: 'kcal/mol' }).value).toBeCloseTo(-212.7868, 4);
  });

  it('gives kJ per kg of a chosen species through its |ν| and molar mass', () => {
    // −890.3 kJ/mol for 1 mol CH4 (M = 16.043 g/mol, CIAAW 2021): −55 494.6 kJ/kg, the higher heating
    // value of methane ≈ 55.5 MJ/kg (engineering handbooks, from memory).
    const basis = { unit: 'kJ/kg' as const, species: { key: 'CH4(g)', coefficient: 1, molarMass: 16.043 } };
    const r = convertEnergy(-890.3, 0.3, basis);
    expect(r.value).toBeCloseTo(-55494.61, 1);
    expect(r.uncertainty).toBeCloseTo(18.7, 1);
    // Per kg of water when 2 mol H2O(l) form in 2 H2 + O2 → 2 H2O: −571.66 kJ / (2 × 18.015 g) = −15 866 kJ/kg.
    const water = { unit: 'kJ/kg' as const, species: { key: 'H2O(l)', coefficient: 2, molarMass: 18.015 } };
    expect(convertEnergy(-571.66, null, water).value).toBeCloseTo(-15866.2, 1);
    expect(energyUnitText(water)).toBe('kJ per kg of H2O(l)');
  });

  it('refuses a per-kg basis without a molar mass', () => {
    const bad = { unit: 'kJ/kg' as const, species: { key: 'X', coefficient: 1, molarMass: 0 } };
    expect(() => convertEnergy(1, null, bad)).toThrow(/molar mass/);
  });
});

describe('temperatures', () => {
  it('reads K, °C and °F', () => {
    // 100 °C = 212 °F = 373.15 K; −40 °C = −40 °F (definitions of the scales; common practice, no source).
    expect(kelvinFrom(100, 'C')).toBeCloseTo(373.15, 10);
    expect(kelvinFrom(212, 'F')).toBeCloseTo(373.15, 10);
    expect(kelvinFrom(-40, 'F')).toBeCloseTo(kelvinFrom(-40, 'C')!, 10);
    expect(kelvinTo(298.15, 'C')).toBeCloseTo(25, 10);
  });

  it('gives null below absolute zero or for no value', () => {
    expect(kelvinFrom(-300, 'C')).toBeNull();
    expect(kelvinFrom(null, 'K')).toBeNull();
  });
});

describe('fractionValue', () => {
  it('reads coefficients as the API sends them', () => {
    expect(fractionValue('3/2')).toBe(1.5);
    expect(fractionValue('-1')).toBe(-1);
    expect(() => fractionValue('x')).toThrow();
  });
});
