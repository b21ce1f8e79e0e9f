import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import {
  amountOfSubstance,
  BATCH_SCREENING_CAUTIONS,
  batchScreening,
  extentOfReaction,
  fuelHeatingValues,
  idealGasMolarVolume,
  KILOGRAMS_PER_POUND,
  limitingReactant,
  massInGrams,
  reactionHeat,
  ThermoInputError,
} from '@shared/chemistry/thermo';

describe('amounts and extent of reaction', () => {
  it('converts pounds exactly: 1 lb = 0.45359237 kg (international yard and pound, 1959)', () => {
    expect(KILOGRAMS_PER_POUND).toBe(0.45359237);
    expect(massInGrams(1, 'lb')).toBe(453.59237);
    expect(massInGrams(2.5, 'kg')).toBe(2500);
  });
  it('ideal-gas molar volume RT/p is 24.79 L/mol at 298.15 K and 1 bar (IUPAC Green Book, 3rd ed., from memory)', () => {
    expect(idealGasMolarVolume(298.15, 1e5)).toBeCloseTo(24.79, 2);
    const n = amountOfSubstance({
      kind: 'gas-volume',
      value: 24.79,
      unit: 'L',
      temperature: 298.15,
      pressure: 1,
      pressureUnit: 'bar',
    });
    expect(n.amount).toBeCloseTo(1, 3);
    expect(n.basis).toMatch(/ideal-gas law/);
    // 22.414 L/mol at 273.15 K and 1 atm (older STP convention, from memory).
    expect(
      amountOfSubstance({
        kind: 'gas-volume',
        value: 22.414,
        unit: 'L',
        temperature: 273.15,
        pressure: 1,
        pressureUnit: 'atm',
      }).amount,
    ).toBeCloseTo(1, 4);
  });
  it('ξ = n/|ν| from a mass, an amount or a gas volume of any term', () => {
    // 1 kg of CH4 (M = 16.043 g/mol, CIAAW 2021 conventional weights) burnt: ξ = 62.33 mol.
    expect(
      extentOfReaction(new Fraction(-1), { kind: 'mass', value: 1, unit: 'kg', molarMass: 16.043 }).extent,
    ).toBeCloseTo(1000 / 16.043, 10);
    expect(extentOfReaction(new Fraction(2), { kind: 'amount', value: 3, unit: 'mol' }).extent).toBe(1.5);
    expect(extentOfReaction(new Fraction('-1/2'), { kind: 'amount', value: 3, unit: 'mol' }).extent).toBe(6);
    expect(() => extentOfReaction(new Fraction(0), { kind: 'amount', value: 1, unit: 'mol' })).toThrow(
      ThermoInputError,
    );
    expect(() => amountOfSubstance({ kind: 'mass', value: -1, unit: 'g', molarMass: 10 })).toThrow(/mass/);
  });
});

describe('limitingReactant', () => {
  it('finds the limiting reactant and the excess of the others (2 H2 + O2 → 2 H2O, worked by hand)', () => {
    const r = limitingReactant([
      { species: 'H2(g)', coefficient: new Fraction(-2), amount: 10 },
      { species: 'O2(g)', coefficient: new Fraction(-1), amount: 7 },
    ]);
    expect(r.limiting).toEqual(['H2(g)']);
    expect(r.extent).toBe(5);
    expect(r.reactants[0]).toMatchObject({ consumed: 10, remaining: 0, limiting: true });
    expect(r.reactants[1]).toMatchObject({ consumed: 5, remaining: 2, limiting: false });
  });
  it('names every reactant that runs out together', () => {
    const r = limitingReactant([
      { species: 'H2(g)', coefficient: new Fraction(2), amount: 0.6 },
      { species: 'O2(g)', coefficient: new Fraction(1), amount: 0.3 },
    ]);
    expect(r.limiting).toEqual(['H2(g)', 'O2(g)']);
    expect(r.reactants.every((x) => x.remaining === 0)).toBe(true);
  });
});

describe('reactionHeat', () => {
  it('Q = ξ·ΔrH with the sign of ΔH, and says released or absorbed', () => {
    const q = reactionHeat(62.33, -802.56, 0.37);
    expect(q.heat).toBeCloseTo(62.33 * -802.56, 9);
    expect(q.direction).toBe('released');
    expect(q.standardUncertainty).toBeCloseTo(62.33 * 0.37, 12);
    expect(q.statement).toMatch(/kJ released$/);
    expect(reactionHeat(2, 44).direction).toBe('absorbed');
    expect(reactionHeat(2, 44).standardUncertainty).toBeNull();
  });
});

describe('fuelHeatingValues', () => {
  // Methane: HHV ≈ 55.5 MJ/kg, LHV ≈ 50.0 MJ/kg (engineering tables of fuel properties, from memory);
  // inputs: ΔcH° to liquid water −890.6 kJ/mol and ΔvapH°(H2O, 298.15 K) = 44.0 kJ/mol (CODATA 1989 difference, from memory).
  it('gives the higher (liquid water) and lower (water vapour) values per mol and per kg, labelled', () => {
    const v = fuelHeatingValues({
      combustionEnthalpy: -890.6,
      waterPhase: 'l',
      fuelCoefficient: new Fraction(1),
      waterCoefficient: new Fraction(2),
      fuelMolarMass: 16.043,
      waterVaporizationEnthalpy: 44.004,
    });
    expect(v.higher.perMole).toBeCloseTo(890.6, 10);
    expect(v.lower.perMole).toBeCloseTo(890.6 - 2 * 44.004, 10);
    expect(v.higher.perKilogram / 1000).toBeCloseTo(55.5, 1);
    expect(v.lower.perKilogram / 1000).toBeCloseTo(50.0, 1);
    expect(v.higher.label).toMatch(/higher.*liquid/);
    expect(v.lower.label).toMatch(/lower.*vapour/);
  });
  it('reads an equation written to steam and per fractional coefficient the same way', () => {
    const v = fuelHeatingValues({
      combustionEnthalpy: -802.56 / 2,
      waterPhase: 'g',
      fuelCoefficient: new Fraction('1/2'),
      waterCoefficient: new Fraction(1),
      fuelMolarMass: 16.043,
      waterVaporizationEnthalpy: 44.004,
      standardUncertainty: 0.2,
    });
    expect(v.lower.perMole).toBeCloseTo(802.56, 10);
    expect(v.higher.perMole).toBeCloseTo(802.56 + 2 * 44.004, 10);
    expect(v.lower.standardUncertaintyPerMole).toBeCloseTo(0.4, 12);
    expect(() =>
      fuelHeatingValues({
        combustionEnthalpy: 10,
        waterPhase: 'l',
        fuelCoefficient: new Fraction(1),
        waterCoefficient: new Fraction(2),
        fuelMolarMass: 16,
        waterVaporizationEnthalpy: 44,
      }),
    ).toThrow(/negative/);
  });
});

describe('batchScreening', () => {
  it('ΔT_ad = Q/(m·cp): 41.84 kJ into 1 kg of water (cp 4.184 J/(g K), common practice, no source) gives 10 K', () => {
    const r = batchScreening({ heat: -41.84, batchMass: { value: 1, unit: 'kg' }, specificHeatCapacity: 4.184 });
    expect(r.adiabaticTemperatureRise).toBeCloseTo(10, 12);
    expect(r.heatReleased).toBeCloseTo(41.84, 12);
    expect(r.specificHeatReleased).toBeCloseTo(41.84, 12);
    expect(r.screeningOnly).toBe(true);
    expect(r.cautions).toBe(BATCH_SCREENING_CAUTIONS);
  });
  it('carries cautions on rate, gas, decomposition, accumulation, scale and review', () => {
    const text = BATCH_SCREENING_CAUTIONS.join(' ');
    for (const word of [
      /screening/i,
      /not how fast/,
      /gas/,
      /decomposition/,
      /accumulates/,
      /vessel grows/,
      /calorimetry/,
      /qualified/,
      /local codes/i,
    ])
      expect(text).toMatch(word);
  });
  it('rejects a zero batch mass or heat capacity, naming the field', () => {
    expect(() => batchScreening({ heat: -1, batchMass: { value: 0, unit: 'kg' }, specificHeatCapacity: 4 })).toThrow(
      /batch mass/,
    );
    try {
      batchScreening({ heat: -1, batchMass: { value: 1, unit: 'lb' }, specificHeatCapacity: 0 });
      expect.unreachable();
    } catch (err) {
      expect((err as ThermoInputError).path).toEqual(['specificHeatCapacity']);
    }
  });
});
