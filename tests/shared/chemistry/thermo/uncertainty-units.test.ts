import { describe, expect, it } from 'vitest';
import {
  fromKelvin,
  kilocaloriesToKilojoules,
  kilojoulesToKilocalories,
  perKilogramToPerMole,
  perMoleToPerKilogram,
  standardUncertainty,
  ThermoInputError,
  toKelvin,
} from '@shared/chemistry/thermo';

describe('standardUncertainty', () => {
  it('reads each stated kind as the GUM (JCGM 100:2008) and thermochemical practice do', () => {
    expect(standardUncertainty({ kind: 'standard', value: 0.3 })).toMatchObject({ u: 0.3, kind: 'standard' });
    // GUM 6.2: U = k·u.
    expect(standardUncertainty({ kind: 'expanded', value: 0.6, k: 2 }).u).toBeCloseTo(0.3, 15);
    expect(standardUncertainty({ kind: 'expanded', value: 0.6, k: 2 }).rule).toMatch(/k = 2: u = U\/k/);
    // Rossini 1956: thermochemists quote twice the standard deviation of the mean (domain notes §2, from memory).
    expect(standardUncertainty({ kind: 'two-sigma', value: 0.26 }).u).toBeCloseTo(0.13, 15);
    // CODATA 1989 limits of unspecified coverage: read as 2u, common practice, no source.
    const interval = standardUncertainty({ kind: 'interval', value: 0.13 });
    expect(interval.u).toBeCloseTo(0.065, 15);
    expect(interval.rule).toContain('common practice, no source');
    expect(standardUncertainty({ kind: 'none' })).toEqual({
      u: null,
      kind: 'none',
      rule: 'no uncertainty stated by the source',
    });
  });
  it('rejects negative values and coverage factors ≤ 0', () => {
    expect(() => standardUncertainty({ kind: 'standard', value: -1 })).toThrow(ThermoInputError);
    expect(() => standardUncertainty({ kind: 'expanded', value: 1, k: 0 })).toThrow(/coverage factor/);
  });
});

describe('temperature units', () => {
  it('converts by the definitions of the Celsius and Fahrenheit scales (SI Brochure, 9th ed.; common practice)', () => {
    expect(toKelvin(25, '°C')).toBeCloseTo(298.15, 12);
    expect(toKelvin(-40, '°F')).toBeCloseTo(233.15, 12); // −40 °F = −40 °C
    expect(toKelvin(212, '°F')).toBeCloseTo(373.15, 12);
    expect(fromKelvin(298.15, '°C')).toBeCloseTo(25, 12);
    expect(fromKelvin(373.15, '°F')).toBeCloseTo(212, 12);
    expect(fromKelvin(500, 'K')).toBe(500);
  });
  it('refuses temperatures at or below absolute zero and non-finite input', () => {
    expect(() => toKelvin(-273.15, '°C')).toThrow(/above absolute zero/);
    expect(() => toKelvin(-500, '°F')).toThrow(ThermoInputError);
    expect(() => toKelvin(Number.NaN, 'K')).toThrow(/finite/);
    expect(() => fromKelvin(0, '°C')).toThrow(ThermoInputError);
  });
});

describe('energy units', () => {
  it('uses the thermochemical calorie, 4.184 J exactly (IUPAC Green Book, 3rd ed., 2007; from memory)', () => {
    expect(kilojoulesToKilocalories(4.184)).toBeCloseTo(1, 15);
    expect(kilocaloriesToKilojoules(-57.8)).toBeCloseTo(-241.8352, 12);
  });
  it('gives kJ per kg of a species from its molar mass: CH4 ΔcH° −890.6 kJ/mol ≈ −55.5 MJ/kg (methane HHV, engineering tables, from memory)', () => {
    const perKg = perMoleToPerKilogram(-890.6, 16.043);
    expect(perKg / 1000).toBeCloseTo(-55.5, 1);
    expect(perKilogramToPerMole(perKg, 16.043)).toBeCloseTo(-890.6, 10);
    expect(() => perMoleToPerKilogram(1, 0)).toThrow(/molar mass/);
  });
});
